import { describe, expect, it } from "vitest";
import { parseSessionScenario, sessionSettingsSchema, spendStepOf } from "../src/index";
import { clone, kiosk } from "./fixtures";

describe("parseSessionScenario", () => {
  it("parseSessionScenario(no session object) fills every default", () => {
    const r = parseSessionScenario(kiosk);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.session).toEqual({
      outcome: "shares",
      rounds: 5,
      clockSeconds: null,
      missingMove: "zero",
      computer: {},
    });
    expect(r.value.rivals).toHaveLength(3);
    expect(r.value.rivals[2]).toEqual({ name: "Rye & Crumb", cost: 2, budget: 30 });
    expect(spendStepOf(r.value.session)).toBe(1);
  });

  it("spendStepOf(settings) reads spendStep, else the older effortStep (same number, now money)", () => {
    const parse = (session: object) => {
      const r = parseSessionScenario({ ...kiosk, session });
      if (!r.ok) throw new Error(r.message);
      return spendStepOf(r.value.session);
    };
    expect(parse({ spendStep: 250 })).toBe(250);
    expect(parse({ effortStep: 500 })).toBe(500);
    expect(parse({ spendStep: 250, effortStep: 500 })).toBe(250);
  });

  it("parseSessionScenario(full session object) keeps the given settings", () => {
    const input = {
      ...clone(kiosk),
      session: {
        outcome: "winner",
        effortStep: 0.5,
        rounds: 3,
        clockSeconds: 90,
        missingMove: "repeat",
        computer: { "Corner Ovens": { kind: "overspender", factor: 1.5 } },
      },
    };
    const r = parseSessionScenario(input);
    expect(r.ok && r.value.session).toEqual(input.session);
  });

  it("parseSessionScenario(bad contest part) reports the solver validator's path", () => {
    const input = clone(kiosk);
    input.rivals[1]!.cost = -3;
    const r = parseSessionScenario(input);
    expect(r).toMatchObject({ ok: false, code: "bad-request", path: "rivals.1.cost" });
    if (!r.ok) expect(r.message).toMatch(/^rivals\.1\.cost: must be > 0/);
  });

  it("parseSessionScenario(unknown top-level field) names the field", () => {
    const r = parseSessionScenario({ ...clone(kiosk), colour: "red" });
    expect(r).toMatchObject({ ok: false, path: "colour" });
  });

  it("parseSessionScenario(bad settings) prefixes the path with session", () => {
    const cases: [unknown, string][] = [
      [{ outcome: "lottery" }, "session.outcome"],
      [{ effortStep: 0 }, "session.effortStep"],
      [{ spendStep: 0 }, "session.spendStep"],
      [{ rounds: 101 }, "session.rounds"],
      [{ rounds: 2.5 }, "session.rounds"],
      [{ clockSeconds: 4 }, "session.clockSeconds"],
      [{ clockSeconds: 3601 }, "session.clockSeconds"],
      [{ missingMove: "random" }, "session.missingMove"],
      [{ speed: 2 }, "session.speed"],
      [{ computer: { "North Bakery": { kind: "genius" } } }, "session.computer.North Bakery.kind"],
    ];
    for (const [session, path] of cases) {
      const r = parseSessionScenario({ ...clone(kiosk), session });
      expect(r, JSON.stringify(session)).toMatchObject({ ok: false, code: "bad-request", path });
      if (!r.ok) expect(r.message.startsWith(`${path}: `)).toBe(true);
    }
  });

  it("parseSessionScenario(computer names an unknown rival) is refused", () => {
    const r = parseSessionScenario({
      ...clone(kiosk),
      session: { computer: { "South Bakery": { kind: "equilibrium" } } },
    });
    expect(r).toMatchObject({ ok: false, path: "session.computer.South Bakery" });
  });

  it("parseSessionScenario(a leader) is refused: live rounds are simultaneous", () => {
    const r = parseSessionScenario({ ...clone(kiosk), leader: "North Bakery" });
    expect(r).toMatchObject({ ok: false, path: "leader" });
  });

  it("parseSessionScenario(1 rival or 65 rivals) is refused", () => {
    const one = { ...clone(kiosk), rivals: [{ name: "Solo", cost: 1 }] };
    expect(parseSessionScenario(one)).toMatchObject({ ok: false, path: "rivals" });
    const many = {
      ...clone(kiosk),
      rivals: Array.from({ length: 65 }, (_, i) => ({ name: `Rival ${i}`, cost: 1 })),
    };
    expect(parseSessionScenario(many)).toMatchObject({ ok: false, path: "rivals" });
    many.rivals.pop();
    expect(parseSessionScenario(many).ok).toBe(true);
  });

  it("parseSessionScenario(NaN, Infinity, huge numbers) is refused", () => {
    for (const prize of [NaN, Infinity, -Infinity]) {
      expect(parseSessionScenario({ ...clone(kiosk), prize })).toMatchObject({
        ok: false,
        path: "prize",
      });
    }
    for (const effortStep of [NaN, Infinity, 1e13]) {
      const r = parseSessionScenario({ ...clone(kiosk), session: { effortStep } });
      expect(r).toMatchObject({ ok: false, path: "session.effortStep" });
    }
  });

  it("parseSessionScenario(non-object) is refused at the root", () => {
    for (const x of [null, 3, "x", []]) {
      expect(parseSessionScenario(x)).toMatchObject({ ok: false, code: "bad-request", path: "" });
    }
  });

  it("sessionSettingsSchema input and output types differ only by defaults", () => {
    expect(sessionSettingsSchema.parse({ rounds: 2 }).rounds).toBe(2);
  });
});
