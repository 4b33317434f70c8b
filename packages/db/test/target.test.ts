import path from "node:path";
import { describe, expect, it } from "vitest";
import { resolveTarget } from "../src/index";

describe("resolveTarget(url)", () => {
  it("resolveTarget(undefined or blank) is PGlite in ./data/pglite under the cwd", () => {
    const expected = { kind: "pglite", dataDir: path.resolve("data/pglite") };
    expect(resolveTarget(undefined)).toEqual(expected);
    expect(resolveTarget("  ")).toEqual(expected);
  });

  it("resolveTarget(memory://) is PGlite in memory", () => {
    expect(resolveTarget("memory://")).toEqual({ kind: "pglite", dataDir: null });
  });

  it("resolveTarget(a path or pglite:<path>) is PGlite in that directory", () => {
    expect(resolveTarget("/var/lib/contend")).toEqual({
      kind: "pglite",
      dataDir: "/var/lib/contend",
    });
    expect(resolveTarget("pglite:./x/y")).toEqual({ kind: "pglite", dataDir: path.resolve("x/y") });
    expect(() => resolveTarget("pglite:")).toThrow(/needs a directory/);
  });

  it("resolveTarget(postgres:// or postgresql://) is a PostgreSQL server", () => {
    for (const url of [
      "postgres://u:p@db:5432/contend",
      "postgresql://db/contend?sslmode=require",
    ]) {
      expect(resolveTarget(url)).toEqual({ kind: "postgres", url });
    }
  });

  it("resolveTarget(another scheme) throws instead of making a directory named after it", () => {
    expect(() => resolveTarget("mysql://db/contend")).toThrow(/unsupported database url scheme/);
  });
});
