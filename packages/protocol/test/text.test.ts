import { describe, expect, it } from "vitest";
import {
  findTextIssue,
  nameProblem,
  parseCommand,
  parseHello,
  parseSessionScenario,
  sessionScenarioSchema,
  textProblem,
} from "../src/index";

const LONE_HIGH = "a\ud800b";
const LONE_LOW = "\udc00";

const scenario = (rivals: unknown[], extra: Record<string, unknown> = {}) => ({
  title: "Harbour tender",
  prize: 100,
  csf: { kind: "ratio", decisiveness: 1 },
  rivals,
  ...extra,
});
const two = [
  { name: "Alder", cost: 1 },
  { name: "Birch", cost: 1 },
];

describe("the text rule", () => {
  it("refuses NUL, lone surrogates and control characters; keeps tabs and newlines in free text", () => {
    expect(textProblem("a\u0000b")).toMatch(/NUL/);
    expect(textProblem(LONE_HIGH)).toMatch(/lone surrogate/);
    expect(textProblem(LONE_LOW)).toMatch(/lone surrogate/);
    expect(textProblem("bell\u0007")).toMatch(/U\+0007/);
    expect(textProblem("c1\u0085")).toMatch(/U\+0085/);
    expect(textProblem("line one\nline two\tand a tab")).toBeNull();
    // a valid surrogate pair (an emoji) is ordinary text
    expect(textProblem("rocket \ud83d\ude80")).toBeNull();
  });

  it("a name also refuses newlines, tabs and the reserved words", () => {
    expect(nameProblem("two\nlines")).toMatch(/U\+000A/);
    for (const word of ["__proto__", "constructor", "prototype", " prototype "]) {
      expect(nameProblem(word)).toMatch(/reserved/);
    }
    expect(nameProblem("Constructors Ltd")).toBeNull();
  });

  it("finds the first bad string or key with its path", () => {
    expect(findTextIssue({ a: [1, { b: "x\u0000" }] })).toEqual({
      path: ["a", 1, "b"],
      message: expect.stringMatching(/NUL/),
    });
    const parsed = JSON.parse('{"ok":1,"__proto__":{"polluted":true}}') as unknown;
    expect(findTextIssue(parsed)).toMatchObject({ path: ["__proto__"] });
    expect(findTextIssue({ fine: "text", n: 3, list: ["a", null] })).toBeNull();
  });
});

describe("every boundary applies it with bad-request naming the field", () => {
  it("scenarios (REST body and the editor's schema)", () => {
    const cases: [unknown, string][] = [
      [scenario([{ name: "__proto__", cost: 1 }, two[1]]), "rivals.0.name"],
      [scenario([{ name: "Al\u0000der", cost: 1 }, two[1]]), "rivals.0.name"],
      [scenario(two, { title: `T${LONE_LOW}` }), "title"],
      [
        scenario(two, { session: { computer: { constructor: { kind: "equilibrium" } } } }),
        "session.computer.constructor",
      ],
    ];
    for (const [raw, path] of cases) {
      const r = parseSessionScenario(raw);
      expect(r, path).toMatchObject({ ok: false, code: "bad-request", path });
      expect(sessionScenarioSchema.safeParse(raw).success).toBe(false);
    }
    expect(parseSessionScenario(scenario(two)).ok).toBe(true);
  });

  it("commands and hellos", () => {
    expect(parseCommand({ type: "sealMove", clientMoveId: "m\u0000", effort: 1 })).toMatchObject({
      ok: false,
      code: "bad-request",
      path: "clientMoveId",
    });
    expect(parseCommand({ type: "claimSeat", seatIndex: 0, displayName: LONE_HIGH })).toMatchObject(
      { ok: false, path: "displayName" },
    );
    expect(
      parseHello({ protocol: 2, credentials: { role: "guest", joinCode: "AB\u0000CD" } }),
    ).toMatchObject({ ok: false, path: "credentials.joinCode" });
  });
});
