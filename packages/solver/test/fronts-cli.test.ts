// The fronts scenario format and its command line: validation names the field, `contend solve`
// and `contend respond` print the documented JSON shapes, bad input exits 2 with one line.
// Reference values: the Friedman split (see fronts-theory.test.ts for its derivation) and the
// solver's own respond, which the property tests check against an independent optimiser.
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { cliRunner } from "./cliRun";
import { normalizeFronts, validateFrontsScenario } from "../src/fronts";

const pkg = fileURLToPath(new URL("..", import.meta.url));

const friedman = {
  title: "Two rivals, sunk budgets, three fronts",
  fronts: [
    { name: "North", prize: 100, csf: { kind: "ratio", decisiveness: 1 } },
    { name: "South", prize: 300, csf: { kind: "ratio", decisiveness: 1 } },
    { name: "East", prize: 600, csf: { kind: "ratio", decisiveness: 1 } },
  ],
  rivals: [
    { name: "A", cost: 1, budget: 30, sunkBudget: true },
    { name: "B", cost: [1, 1, 1], budget: 70, sunkBudget: true },
  ],
};

const withRival = (i: number, patch: object) => ({
  ...friedman,
  rivals: friedman.rivals.map((r, j) => (j === i ? { ...r, ...patch } : r)),
});

const files: Record<string, string> = {
  "friedman.json": JSON.stringify(friedman),
  "short-cost.json": JSON.stringify(withRival(1, { cost: [1, 2] })),
  "neg-budget.json": JSON.stringify(withRival(0, { budget: -5, sunkBudget: false })),
  "zero-cost.json": JSON.stringify(withRival(1, { cost: [1, 0, 1] })),
  "sunk-no-budget.json": JSON.stringify(withRival(0, { budget: null })),
  "prize-too.json": JSON.stringify({ ...friedman, prize: 100 }),
  "allpay.json": JSON.stringify({
    ...friedman,
    fronts: [...friedman.fronts.slice(0, 2), { name: "East", prize: 600, csf: { kind: "allpay" } }],
  }),
};

const run = cliRunner(files);

describe("validateFrontsScenario names the offending field", () => {
  const cases: [string, object, string, RegExp][] = [
    [
      "an array whose length is not the number of fronts",
      withRival(1, { cost: [1, 2] }),
      "rivals.1.cost",
      /one entry per front \(3\), got 2/,
    ],
    [
      "a negative budget",
      withRival(0, { budget: -5, sunkBudget: false }),
      "rivals.0.budget",
      />= 0/,
    ],
    ["a cost <= 0 on one front", withRival(1, { cost: [1, 0, 1] }), "rivals.1.cost.1", /> 0/],
    ["a scalar cost <= 0", withRival(0, { cost: -1 }), "rivals.0.cost", /> 0/],
    [
      "sunkBudget without a budget",
      withRival(0, { budget: null }),
      "rivals.0.sunkBudget",
      /needs a budget/,
    ],
    [
      "a value array of the wrong length",
      withRival(0, { value: [1, 2, 3, 4] }),
      "rivals.0.value",
      /one entry per front/,
    ],
    ["prize beside fronts", { ...friedman, prize: 1 }, "prize", /each front has its own/],
    [
      "a front's bad decisiveness",
      { ...friedman, fronts: [{ name: "X", prize: 1, csf: { kind: "ratio", decisiveness: 0 } }] },
      "fronts.0.csf.decisiveness",
      /> 0/,
    ],
    [
      "nine all-pay fronts",
      {
        ...friedman,
        fronts: Array.from({ length: 9 }, (_, k) => ({
          name: `T${k}`,
          prize: 1,
          csf: { kind: "allpay" },
        })),
      },
      "fronts.8.csf.kind",
      /at most 8 fronts may be "allpay"/,
    ],
    [
      "duplicate front names",
      { ...friedman, fronts: [friedman.fronts[0], friedman.fronts[0]] },
      "fronts.1.name",
      /duplicates/,
    ],
    ["no fronts", { ...friedman, fronts: [] }, "fronts", /1 to/],
  ];
  for (const [what, input, path, message] of cases) {
    it(`rejects ${what} at ${path}`, () => {
      const v = validateFrontsScenario(input);
      expect(v.ok).toBe(false);
      if (v.ok) return;
      expect(v.path).toBe(path);
      expect(v.message).toMatch(message);
    });
  }

  it("accepts per-front arrays and scalars and fills defaults (value = the front's prize, weight 1)", () => {
    const v = validateFrontsScenario(withRival(1, { value: [10, 20, 30], weight: 2 }));
    expect(v.ok).toBe(true);
    if (!v.ok) return;
    const c = normalizeFronts(v.value);
    expect(c.rivals[0]!.value).toEqual([100, 300, 600]);
    expect(c.rivals[0]!.weight).toEqual([1, 1, 1]);
    expect(c.rivals[1]!.value).toEqual([10, 20, 30]);
    expect(c.rivals[1]!.weight).toEqual([2, 2, 2]);
    expect(c.rivals[1]!.sunkBudget).toBe(true);
  });
});

describe("contend solve / respond with fronts", () => {
  it("solve FILE --json prints exactly the documented keys, rows rivals and columns fronts", async () => {
    const r = await run("solve", "friedman.json", "--json");
    expect(r.code).toBe(0);
    expect(r.stderr).toBe("");
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual(["equilibrium", "alternatives"]);
    expect(out.alternatives).toEqual([]);
    const eq = out.equilibrium;
    expect(Object.keys(eq)).toEqual([
      "kind",
      "allocations",
      "spends",
      "shares",
      "payoffs",
      "budgetUsed",
      "frontTotals",
      "shadowPrices",
      "nashGap",
    ]);
    expect(eq.kind).toBe("pure");
    // Friedman 1958: x_ik = B_i V_k / sum V (derived in fronts-theory.test.ts)
    const want = [
      [3, 9, 18],
      [7, 21, 42],
    ];
    want.forEach((row, i) => row.forEach((x, k) => expect(eq.allocations[i][k]).toBeCloseTo(x, 6)));
    expect(eq.budgetUsed[0]).toBeCloseTo(30, 8);
    expect(eq.frontTotals[2]).toBeCloseTo(60, 6);
    expect(eq.shadowPrices.every((x: number) => x > 0)).toBe(true);
  });

  it("solve FILE (no --json) prints spend, share and reading tables with the cautions", async () => {
    const r = await run("solve", "friedman.json");
    expect(r.code).toBe(0);
    for (const s of [
      "Spend by front",
      "Share won on each front",
      "Reading",
      "Shadow price",
      "Caution",
    ]) {
      expect(r.stdout).toContain(s);
    }
  });

  it("respond FILE --allocations rows --json prints bestAllocations, regrets, payoffs and nashGap", async () => {
    const r = await run("respond", "friedman.json", "--allocations", "10,10,10;7,21,42", "--json");
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual(["bestAllocations", "regrets", "payoffs", "nashGap"]);
    // B already plays the Friedman split; A's even split is not a best reply to it
    expect(out.regrets[0]).toBeGreaterThan(1);
    expect(out.bestAllocations[0].reduce((a: number, b: number) => a + b, 0)).toBeLessThanOrEqual(
      30,
    );
    expect(out.nashGap).toBe(Math.max(...out.regrets));
  });

  const badInputs: [string, string[], RegExp][] = [
    [
      "an array of the wrong length",
      ["solve", "short-cost.json"],
      /^contend: short-cost\.json: rivals\.1\.cost: /,
    ],
    [
      "a negative budget",
      ["solve", "neg-budget.json"],
      /^contend: neg-budget\.json: rivals\.0\.budget: /,
    ],
    [
      "a cost of zero",
      ["solve", "zero-cost.json"],
      /^contend: zero-cost\.json: rivals\.1\.cost\.1: /,
    ],
    [
      "sunkBudget without a budget",
      ["solve", "sunk-no-budget.json"],
      /rivals\.0\.sunkBudget: needs a budget/,
    ],
    ["prize beside fronts", ["solve", "prize-too.json"], /: prize: /],
    [
      "a row too many",
      ["respond", "friedman.json", "--allocations", "1,1,1;1,1,1;1,1,1"],
      /^contend: --allocations: expected 2 rows/,
    ],
    [
      "a row over budget",
      ["respond", "friedman.json", "--allocations", "10,10,11;1,1,1"],
      /row 1 \(A\) spends 31 in total, more than its budget 30/,
    ],
    [
      "--efforts with fronts",
      ["respond", "friedman.json", "--efforts", "1,2"],
      /^contend: --efforts: this scenario has fronts/,
    ],
    [
      "sweep with fronts",
      ["sweep", "friedman.json", "--param", "prize", "--from", "1", "--to", "2", "--steps", "2"],
      /not available for scenarios with fronts/,
    ],
  ];
  for (const [what, argv, line] of badInputs) {
    it(`exits 2 with one stderr line naming the field for ${what}`, async () => {
      const r = await run(...argv);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe("");
      expect(r.stderr.trimEnd().split("\n")).toHaveLength(1);
      expect(r.stderr).toMatch(line);
    });
  }

  it("solve scenarios/roaster-districts.json (the invented demo) reports a pure equilibrium within budgets", async () => {
    const r = await run("solve", `${pkg}scenarios/roaster-districts.json`, "--json");
    expect(r.code).toBe(0);
    const eq = JSON.parse(r.stdout).equilibrium;
    expect(eq.kind).toBe("pure");
    const budgets = [90000, 60000, 20000];
    eq.budgetUsed.forEach((b: number, i: number) => expect(b).toBeLessThanOrEqual(budgets[i]!));
    expect(eq.nashGap).toBeLessThan(1e-6 * 450000);
  });

  it("solve with an all-pay front prints none-pure with the reason naming the front (exit 0)", async () => {
    const r = await run("solve", "allpay.json", "--json");
    expect(r.code).toBe(0);
    const eq = JSON.parse(r.stdout).equilibrium;
    expect(eq.kind).toBe("none-pure");
    expect(eq.allocations).toBeNull();
    expect(eq.note).toMatch(/front "East" is an all-pay auction/);
    // respond still gives each rival's best allocation: outbid B's 50 on East by a step, or not
    const resp = await run(
      "respond",
      "allpay.json",
      "--allocations",
      "10,10,10;10,10,50",
      "--json",
    );
    expect(resp.code).toBe(0);
    const out = JSON.parse(resp.stdout);
    out.bestAllocations.forEach((row: number[], i: number) =>
      expect(row.reduce((a, b) => a + b, 0)).toBeLessThanOrEqual([30, 70][i]! * (1 + 1e-12)),
    );
    // A cannot reach 50 with a budget of 30: it concedes East and keeps its ratio fronts
    expect(out.bestAllocations[0][2]).toBe(0);
  });
});
