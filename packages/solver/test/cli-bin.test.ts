// The `contend` command as users reach it: package.json "bin" must name a file that is in the
// repository (so `npm ci` links something that exists, with no build step), and the command npm
// links must answer --help and solve a scenario.
import { execFileSync, spawnSync } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";

const pkgDir = fileURLToPath(new URL("..", import.meta.url));
const manifest = JSON.parse(readFileSync(path.join(pkgDir, "package.json"), "utf8")) as {
  bin: Record<string, string>;
};
const binPath = path.resolve(pkgDir, manifest.bin.contend ?? "");
const kiosk = path.join(pkgDir, "scenarios/kiosk-lease.json");

describe("contend bin", () => {
  it("package.json bin.contend is a file tracked by git, not a build output", () => {
    expect(existsSync(binPath)).toBe(true);
    // throws (test fails) when the path is not tracked, e.g. dist/ which .gitignore excludes
    const tracked = execFileSync("git", ["ls-files", "--error-unmatch", binPath], {
      cwd: pkgDir,
      encoding: "utf8",
    });
    expect(tracked.trim()).not.toBe("");
  });

  it("contend --help exits 0 with the usage", () => {
    const r = spawnSync(process.execPath, [binPath, "--help"], { encoding: "utf8" });
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^Usage:/m);
    expect(r.stdout).toMatch(/contend solve FILE/);
  });

  it("contend solve kiosk-lease.json --json exits 0 with the equilibrium; a missing file exits 2", () => {
    const ok = spawnSync(process.execPath, [binPath, "solve", kiosk, "--json"], {
      encoding: "utf8",
    });
    expect(ok.status).toBe(0);
    expect(JSON.parse(ok.stdout).equilibrium.kind).toBe("pure");
    const bad = spawnSync(process.execPath, [binPath, "solve", `${kiosk}.missing`], {
      encoding: "utf8",
    });
    expect(bad.status).toBe(2);
    expect(bad.stdout).toBe("");
  });

  it("package-lock.json, from which npm ci links bins, names the same file", () => {
    const root = path.resolve(pkgDir, "../..");
    const lock = JSON.parse(readFileSync(path.join(root, "package-lock.json"), "utf8")) as {
      packages: Record<string, { bin?: Record<string, string> }>;
    };
    const locked = lock.packages["packages/solver"]?.bin?.contend ?? "";
    expect(path.resolve(pkgDir, locked)).toBe(binPath);
  });
});
