// The fronts explorer's form conversion: the solver's validator is the rule book, so these
// tests check that the form turns into files it accepts and that editing fronts keeps every
// rival's per-front figures aligned. Demo data are invented.
import { describe, expect, it } from "vitest";
import { normalizeFronts, validateFrontsScenario } from "@contend/solver";
import {
  addFront,
  addRival,
  frontsFormToRaw,
  frontsParamValue,
  initialFrontsForm,
  removeFront,
  scenarioToFrontsForm,
} from "../src/lib/frontsForm";

describe("fronts form", () => {
  it("frontsFormToRaw(initial form) is a valid fronts scenario with money budgets and a sunk one", () => {
    const v = validateFrontsScenario(frontsFormToRaw(initialFrontsForm()));
    expect(v.ok).toBe(true);
    if (!v.ok) return;
    expect(v.value.rivals.map((r) => r.budget)).toEqual([40000, 25000, 10000]);
    expect(v.value.rivals[1]!.sunkBudget).toBe(true);
    // blank values stay defaults: the front's prize
    expect(normalizeFronts(v.value).rivals[0]!.value).toEqual([90000, 60000, 30000]);
  });

  it("addFront / removeFront keep each rival's cost, value and weight one per front", () => {
    let f = addFront(initialFrontsForm());
    expect(f.fronts).toHaveLength(4);
    for (const r of f.rivals)
      for (const a of [r.cost, r.value, r.weight]) expect(a).toHaveLength(4);
    f = removeFront(f, 1);
    expect(f.fronts.map((x) => x.name)).toEqual(["Centre", "Hillside", "Front 4"]);
    expect(f.rivals[0]!.cost).toEqual(["1", "1.2", "1"]);
    expect(validateFrontsScenario(frontsFormToRaw(addRival(f))).ok).toBe(true);
  });

  it("frontsFormToRaw(bad cell) lets the validator name the field", () => {
    const f = initialFrontsForm();
    f.rivals[2]!.cost[1] = "-2";
    const v = validateFrontsScenario(frontsFormToRaw(f));
    expect(v.ok ? "" : v.path).toBe("rivals.2.cost.1");
  });

  it("scenarioToFrontsForm round-trips and frontsParamValue reads sweep paths", () => {
    const v = validateFrontsScenario(frontsFormToRaw(initialFrontsForm()));
    if (!v.ok) throw new Error(v.message);
    const again = validateFrontsScenario(frontsFormToRaw(scenarioToFrontsForm(v.value)));
    expect(again.ok && normalizeFronts(again.value).rivals).toEqual(
      normalizeFronts(v.value).rivals,
    );
    expect(frontsParamValue(v.value, "fronts.1.csf.decisiveness")).toBe(0.8);
    expect(frontsParamValue(v.value, "rivals.2.cost.2")).toBe(0.9);
    expect(frontsParamValue(v.value, "rivals.0.value.1")).toBe(60000);
    expect(frontsParamValue(v.value, "rivals.0.budget")).toBe(40000);
  });
});
