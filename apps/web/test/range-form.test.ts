import { describe, expect, it } from "vitest";
import type { Scenario } from "@contend/solver";
import {
  buildUncertain,
  defaultRange,
  rangeFields,
  rangeKeyOf,
  rangesByPath,
} from "../src/lib/rangeForm";

const s: Scenario = {
  title: "Two",
  prize: 100,
  currency: "$",
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "A", cost: 1 },
    { name: "B", cost: 2, budget: 40 },
  ],
};

describe("range form", () => {
  it("rangeFields(scenario) lists the prize and four fields per rival with their point values", () => {
    const f = rangeFields(s);
    expect(f.map((x) => x.path)).toEqual([
      "prize",
      "rivals.0.cost",
      "rivals.0.value",
      "rivals.0.weight",
      "rivals.0.budget",
      "rivals.1.cost",
      "rivals.1.value",
      "rivals.1.weight",
      "rivals.1.budget",
    ]);
    expect(f.find((x) => x.path === "rivals.0.value")!.point).toBe(100);
    expect(f.find((x) => x.path === "rivals.0.budget")!.point).toBeNull();
    expect(f.find((x) => x.path === "rivals.1.budget")!.unit).toBe("money");
  });

  it("defaultRange(field) spans 20% either side; a missing budget spans a quarter to all of the prize", () => {
    const f = rangeFields(s);
    expect(defaultRange(f[5]!, 100)).toMatchObject({ low: "1.6", high: "2.4", dist: "uniform" });
    expect(defaultRange(f[4]!, 100)).toMatchObject({ low: "25", high: "100" });
  });

  it("buildUncertain(switched-on ranges) gives the solver's scenario; switched-off ones are ignored", () => {
    const r = buildUncertain(s, {
      "rivals.1.cost": { on: true, dist: "triangular", low: "1", mode: "2", high: "4" },
      prize: { on: false, dist: "uniform", low: "1", mode: "", high: "2" },
    });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.count).toBe(1);
    expect(r.scenario.prize).toBe(100);
    expect(r.scenario.rivals[1]!.cost).toEqual({ dist: "triangular", low: 1, mode: 2, high: 4 });
  });

  it("buildUncertain(bad range) names the field and the part of the range at fault", () => {
    const r = buildUncertain(s, {
      "rivals.1.budget": { on: true, dist: "uniform", low: "50", mode: "", high: "x" },
    });
    expect(r).toMatchObject({ ok: false, field: "rivals.1.budget" });
    if (!r.ok) expect(r.message).toMatch(/^rivals\.1\.budget\.high: must be a finite number/);
  });

  it("rangesByPath(ranges by row key) follows the rows: removing a rival does not move another's range onto it", () => {
    const r = { on: true, dist: "uniform", low: "1", mode: "1", high: "2" } as const;
    const keys = ["row-1", "row-2", "row-3"];
    const byKey = {
      [rangeKeyOf("rivals.2.cost", keys)]: r,
      [rangeKeyOf("prize", keys)]: r,
    };
    expect(Object.keys(byKey).sort()).toEqual(["prize", "row-3.cost"]);
    expect(Object.keys(rangesByPath(byKey, keys)).sort()).toEqual(["prize", "rivals.2.cost"]);
    // row-2 removed: row-3 is now rivals.1
    expect(Object.keys(rangesByPath(byKey, ["row-1", "row-3"])).sort()).toEqual([
      "prize",
      "rivals.1.cost",
    ]);
    // row-3 removed: its range goes with it
    expect(Object.keys(rangesByPath(byKey, ["row-1", "row-2"]))).toEqual(["prize"]);
  });
});
