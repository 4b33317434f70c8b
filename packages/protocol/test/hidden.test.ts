/** session.hidden (docs/protocol.md R40): each problem names its field. */
import { describe, expect, it } from "vitest";
import { hiddenRangeIssues, hiddenSettingsSchema, parseSessionScenario } from "../src/index";
import { kiosk } from "./fixtures";

const uniform = (low: number, high: number) => ({ dist: "uniform", low, high });

function parse(hidden: unknown) {
  return parseSessionScenario({ ...kiosk, session: { hidden } });
}

describe("session.hidden", () => {
  it("accepts private costs and values with ranges; truth defaults to draw", () => {
    const r = parse({
      rivals: { "Corner Ovens": { cost: uniform(1, 3), value: uniform(80, 120) } },
    });
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.value.session.hidden?.truth).toBe("draw");
  });

  it.each([
    [
      { rivals: { Nobody: { cost: uniform(1, 3) } } },
      "session.hidden.rivals.Nobody",
      /names no rival/,
    ],
    [
      { rivals: { "Corner Ovens": { cost: uniform(3, 1) } } },
      "session.hidden.rivals.Corner Ovens.cost.high",
      /must be >= low/,
    ],
    [
      { rivals: { "Corner Ovens": { cost: uniform(-1, 1) } } },
      "session.hidden.rivals.Corner Ovens.cost.low",
      /> 0/,
    ],
    [
      { rivals: { "Corner Ovens": { cost: { dist: "triangular", low: 1, mode: 4, high: 3 } } } },
      "session.hidden.rivals.Corner Ovens.cost.high",
      /must be >= mode/,
    ],
    [
      { rivals: { "Corner Ovens": { budget: uniform(1, 3) } } },
      "session.hidden.rivals.Corner Ovens.budget",
      /unknown field "budget"; allowed: cost, value$/,
    ],
    [
      { rivals: { "Corner Ovens": { cost: 2 } } },
      "session.hidden.rivals.Corner Ovens.cost",
      /must be a range/,
    ],
    [{ rivals: {} }, "session.hidden.rivals", /at least one/],
  ])("refuses %j at %s", (hidden, path, message) => {
    const r = parse(hidden);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.path).toBe(path);
    expect(r.message).toMatch(message);
  });

  it('truth "scenario": each true number must lie in its range', () => {
    const corner = kiosk.rivals.findIndex((x) => x.name === "Corner Ovens");
    const cost = kiosk.rivals[corner]!.cost;
    const ok = parse({
      truth: "scenario",
      rivals: { "Corner Ovens": { cost: uniform(cost, cost + 1) } },
    });
    expect(ok.ok).toBe(true);
    const bad = parse({
      truth: "scenario",
      rivals: { "Corner Ovens": { cost: uniform(cost + 1, cost + 2) } },
    });
    expect(bad.ok).toBe(false);
    if (bad.ok) return;
    expect(bad.path).toBe(`rivals.${corner}.cost`);
    expect(bad.message).toMatch(/outside its private range/);
  });
});

describe("hiddenRangeIssues: every problem at once, for a form", () => {
  it("lists one problem per private field, each at its own path, in the order the schema gives the first", () => {
    const hidden = hiddenSettingsSchema.parse({
      rivals: {
        "Corner Ovens": { cost: uniform(3, 1), value: uniform(-5, 10) },
        "North Bakery": { value: uniform(80, 120) },
        Nobody: { cost: uniform(1, 2) },
      },
    });
    const issues = hiddenRangeIssues(
      kiosk.rivals.map((r) => r.name),
      hidden,
    );
    expect(issues.map((i) => i.path.join("."))).toEqual([
      "session.hidden.rivals.Corner Ovens.cost.high",
      "session.hidden.rivals.Corner Ovens.value.low",
      "session.hidden.rivals.Nobody",
    ]);
    // the first is what the session schema reports (one rule, one place)
    const whole = parseSessionScenario({ ...kiosk, session: { hidden } });
    expect(whole.ok).toBe(false);
    if (!whole.ok) expect(whole.path).toBe(issues[0]!.path.join("."));
  });

  it("is empty for valid ranges (positive control for the list above)", () => {
    const hidden = hiddenSettingsSchema.parse({
      rivals: { "Corner Ovens": { cost: uniform(1, 3), value: uniform(80, 120) } },
    });
    expect(
      hiddenRangeIssues(
        kiosk.rivals.map((r) => r.name),
        hidden,
      ),
    ).toEqual([]);
  });
});
