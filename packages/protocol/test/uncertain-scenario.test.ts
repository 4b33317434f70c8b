import { describe, expect, it } from "vitest";
import { contestScenarioSchema, uncertainScenarioSchema } from "../src/index";

const ranged = {
  title: "Ranges",
  prize: { dist: "uniform", low: 80, high: 120 },
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "A", cost: 1 },
    { name: "B", cost: { dist: "triangular", low: 0.5, mode: 1, high: 2 } },
  ],
};

describe("uncertainScenarioSchema", () => {
  it("uncertainScenarioSchema(ranges) accepts them through the solver's validator", () => {
    const r = uncertainScenarioSchema.safeParse(ranged);
    expect(r.success).toBe(true);
    if (r.success) expect(r.data.rivals[1]!.cost).toEqual(ranged.rivals[1]!.cost);
  });

  it("uncertainScenarioSchema(bad range) reports a zod issue at the field inside the range", () => {
    const bad = {
      ...ranged,
      rivals: [
        ranged.rivals[0],
        { name: "B", cost: { dist: "triangular", low: 1, mode: 0.5, high: 2 } },
      ],
    };
    const r = uncertainScenarioSchema.safeParse(bad);
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues[0]!.path).toEqual(["rivals", 1, "cost", "mode"]);
  });

  it("contestScenarioSchema(ranges) refuses them: live sessions take points", () => {
    const r = contestScenarioSchema.safeParse(ranged);
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues[0]!.path).toEqual(["prize"]);
  });
});
