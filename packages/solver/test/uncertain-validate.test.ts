import { describe, expect, it } from "vitest";
import { validateScenario } from "../src/validate";
import { uncertainParams, validateUncertainScenario } from "../src/uncertain";

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Loose = any;

const base = (): Loose => ({
  title: "Ranges",
  prize: { dist: "uniform", low: 80, high: 120 },
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "A", cost: 1, budget: { dist: "uniform", low: 0, high: 50 } },
    {
      name: "B",
      cost: { dist: "triangular", low: 0.5, mode: 1, high: 2 },
      value: { dist: "uniform", low: 90, high: 90 },
      weight: { dist: "triangular", low: 1, mode: 1, high: 1.5 },
    },
  ],
});

function errorOf(mutate: (s: Loose) => void) {
  const s = base();
  mutate(s);
  const r = validateUncertainScenario(s);
  if (r.ok) throw new Error("expected a validation error");
  return r;
}

describe("validateUncertainScenario", () => {
  it("validateUncertainScenario(ranges in prize, cost, value, weight, budget) keeps them, in a fixed order", () => {
    const r = validateUncertainScenario(base());
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.prize).toEqual({ dist: "uniform", low: 80, high: 120 });
    expect(r.value.rivals[1]!.cost).toEqual({ dist: "triangular", low: 0.5, mode: 1, high: 2 });
    expect(uncertainParams(r.value).map((p) => p.path)).toEqual([
      "prize",
      "rivals.0.budget",
      "rivals.1.cost",
      "rivals.1.value",
      "rivals.1.weight",
    ]);
  });

  it("validateUncertainScenario(point scenario) equals validateScenario's copy", () => {
    const point = { ...base(), prize: 100 };
    point.rivals = [
      { name: "A", cost: 1 },
      { name: "B", cost: 2, value: 90 },
    ];
    const a = validateUncertainScenario(point);
    const b = validateScenario(point);
    expect(a).toEqual(b);
  });

  const cases: [string, (s: Loose) => void, string, RegExp][] = [
    ["unknown kind", (s) => (s.prize.dist = "normal"), "prize.dist", /"uniform" or "triangular"/],
    [
      "missing kind",
      (s) => (s.rivals[0].cost = { low: 1, high: 2 }),
      "rivals.0.cost.dist",
      /uniform/,
    ],
    ["missing high", (s) => delete s.prize.high, "prize.high", /finite number/],
    ["non-number low", (s) => (s.prize.low = "80"), "prize.low", /finite number/],
    ["cost low <= 0", (s) => (s.rivals[1].cost.low = 0), "rivals.1.cost.low", /> 0/],
    ["negative budget", (s) => (s.rivals[0].budget.low = -1), "rivals.0.budget.low", />= 0/],
    ["weight low <= 0", (s) => (s.rivals[1].weight.low = -2), "rivals.1.weight.low", /> 0/],
    ["uniform low > high", (s) => (s.prize.low = 130), "prize.high", /must be >= low/],
    [
      "mode below low",
      (s) => (s.rivals[1].cost.mode = 0.4),
      "rivals.1.cost.mode",
      /must be >= low/,
    ],
    [
      "mode above high",
      (s) => (s.rivals[1].cost.mode = 3),
      "rivals.1.cost.high",
      /must be >= mode/,
    ],
    [
      "triangular without mode",
      (s) => delete s.rivals[1].cost.mode,
      "rivals.1.cost.mode",
      /finite/,
    ],
    ["extra field", (s) => (s.prize.mode = 100), "prize.mode", /unknown field in a uniform range/],
    ["infinite high", (s) => (s.prize.high = Infinity), "prize.high", /finite number/],
  ];
  for (const [name, mutate, path, message] of cases) {
    it(`validateUncertainScenario(${name}) names ${path}`, () => {
      const e = errorOf(mutate);
      expect(e.path).toBe(path);
      expect(e.message).toMatch(message);
    });
  }

  it("validateUncertainScenario(range in decisiveness) is refused: only prize, cost, value, weight, budget take ranges", () => {
    const e = errorOf((s) => (s.rivals[0].decisiveness = { dist: "uniform", low: 0.5, high: 1 }));
    expect(e.path).toBe("rivals.0.decisiveness");
  });

  it("validateUncertainScenario(other problems) still reports them through the point rules", () => {
    const e = errorOf((s) => (s.rivals[1].name = "A"));
    expect(e.path).toBe("rivals.1.name");
  });

  it("validateScenario(ranges) refuses them: point scenarios stay points", () => {
    const r = validateScenario(base());
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.path).toBe("prize");
  });
});
