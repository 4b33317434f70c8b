import { describe, expect, it } from "vitest";
import {
  normaliseTag,
  parseInput,
  parseScenarioSave,
  renameScenarioBodySchema,
  saveScenarioBodySchema,
  sessionFilterSchema,
  sessionPatchSchema,
  tagProblem,
} from "../src/index";

describe("the tag rule", () => {
  it("normalises: trimmed, inner white space made one space, lower case", () => {
    expect(normaliseTag("  Board \t Review ")).toBe("board review");
    expect(normaliseTag("Q3")).toBe("q3");
  });
  it("refuses empty, long, comma, control characters and reserved words", () => {
    expect(tagProblem("   ")).toMatch(/empty/);
    expect(tagProblem("x".repeat(33))).toMatch(/at most 32/);
    expect(tagProblem("x".repeat(32))).toBeNull();
    expect(tagProblem("a,b")).toMatch(/comma/);
    expect(tagProblem("a\u0007b")).toMatch(/U\+0007/);
    expect(tagProblem("__proto__")).toMatch(/reserved/);
  });
});

describe("library edits and filters", () => {
  it("a patch needs a change, and names the field at fault", () => {
    expect(parseInput(sessionPatchSchema, {})).toMatchObject({ ok: false, path: "" });
    expect(parseInput(sessionPatchSchema, { addTags: ["ok", " "] })).toMatchObject({
      ok: false,
      path: "addTags.1",
    });
    expect(parseInput(sessionPatchSchema, { addTags: Array(21).fill("t") })).toMatchObject({
      ok: false,
      path: "addTags",
    });
    expect(parseInput(sessionPatchSchema, { title: " Q3 drill ", addTags: ["Q3"] })).toEqual({
      ok: true,
      value: { title: "Q3 drill", addTags: ["q3"] },
    });
  });
  it("a filter hides archived sessions by default and checks its ranges", () => {
    expect(parseInput(sessionFilterSchema, {})).toEqual({ ok: true, value: { archived: "hide" } });
    expect(
      parseInput(sessionFilterSchema, {
        endedFrom: "2026-02-01T00:00:00Z",
        endedTo: "2026-01-01T00:00:00Z",
      }),
    ).toMatchObject({ ok: false, path: "endedTo" });
    expect(parseInput(sessionFilterSchema, { createdFrom: "2026-02-01" })).toMatchObject({
      ok: false,
      path: "createdFrom",
    });
    expect(parseInput(sessionFilterSchema, { archived: "some" })).toMatchObject({
      ok: false,
      path: "archived",
    });
  });
  it("a scenario save names fields inside the scenario", () => {
    const scenario = {
      title: "Harbour tender",
      prize: 100,
      csf: { kind: "ratio", decisiveness: 1 },
      rivals: [
        { name: "Alder", cost: 1 },
        { name: "Birch", cost: 0 },
      ],
    };
    expect(parseScenarioSave({ name: "Tender", scenario }, true)).toMatchObject({
      ok: false,
      path: "scenario.rivals.1.cost",
    });
    scenario.rivals[1]!.cost = 2;
    expect(parseScenarioSave({ name: "Tender", scenario }, true)).toMatchObject({ ok: true });
    expect(parseScenarioSave({ scenario }, false)).toMatchObject({ ok: true });
    expect(parseScenarioSave({ name: "Tender", scenario }, false)).toMatchObject({
      ok: false,
      path: "name",
    });
  });
  it("a scenario rename takes the first save's name rule, and nothing else", () => {
    const rename = (body: unknown) => parseInput(renameScenarioBodySchema, body);
    expect(rename({ name: "  Kiosk lease, base case " })).toEqual({
      ok: true,
      value: { name: "Kiosk lease, base case" },
    });
    for (const body of [{ name: "" }, { name: "x".repeat(81) }, { name: "a\nb" }, {}]) {
      expect(rename(body), JSON.stringify(body)).toMatchObject({ ok: false, path: "name" });
    }
    expect(rename({ name: "x".repeat(80) })).toMatchObject({ ok: true });
    expect(rename({ name: "X", note: "n" })).toMatchObject({ ok: false, path: "note" });
    // the same names pass and fail on the first save
    for (const name of ["", "x".repeat(81), "Kiosk lease v1"]) {
      const save = saveScenarioBodySchema.safeParse({ name, scenario: {} }).success;
      expect(rename({ name }).ok, name).toBe(save);
    }
  });
});
