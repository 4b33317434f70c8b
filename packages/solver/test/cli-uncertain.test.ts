import { describe, expect, it } from "vitest";
import { cliRunner } from "./cliRun";

const good = {
  title: "Ranges",
  prize: { dist: "triangular", low: 80, mode: 100, high: 150 },
  currency: "EUR",
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "A", cost: 1 },
    { name: "B", cost: { dist: "uniform", low: 0.5, high: 2 } },
    { name: "C", cost: 1.5, budget: { dist: "uniform", low: 5, high: 30 } },
  ],
};

function withRival(i: number, patch: Record<string, unknown>) {
  const rivals = good.rivals.map((r, k) => (k === i ? { ...r, ...patch } : r));
  return JSON.stringify({ ...good, rivals });
}

const files: Record<string, string> = {
  "good.json": JSON.stringify(good),
  "badkind.json": JSON.stringify({ ...good, prize: { dist: "lognormal", low: 1, high: 2 } }),
  "lowhigh.json": withRival(1, { cost: { dist: "uniform", low: 3, high: 2 } }),
  "mode.json": withRival(1, { cost: { dist: "triangular", low: 1, mode: 4, high: 2 } }),
  "negcost.json": withRival(1, { cost: { dist: "uniform", low: -1, high: 2 } }),
  "negbudget.json": withRival(2, { budget: { dist: "uniform", low: -5, high: 2 } }),
  "extra.json": withRival(0, { value: { dist: "uniform", low: 1, high: 2, mode: 1.5 } }),
};

const run = cliRunner(files, { disk: false });

describe("contend uncertain", () => {
  it("main(uncertain FILE --json) prints the documented shape, arrays in rival order", async () => {
    const r = await run(
      "uncertain",
      "good.json",
      "--draws",
      "500",
      "--seed",
      "4",
      "--plan",
      "A",
      "--json",
    );
    expect(r.stderr).toBe("");
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out).slice(0, 11)).toEqual([
      "draws",
      "seed",
      "noPureEquilibrium",
      "efforts",
      "spends",
      "shares",
      "payoffs",
      "activeProbability",
      "sensitivity",
      "plan",
      "pureDraws",
    ]);
    expect(out.draws).toBe(500);
    expect(out.seed).toBe(4);
    for (const key of ["efforts", "spends", "shares", "payoffs"]) {
      expect(Object.keys(out[key])).toEqual(["mean", "p10", "p50", "p90"]);
      expect(out[key].p50).toHaveLength(3);
    }
    expect(out.activeProbability).toHaveLength(3);
    expect(out.sensitivity.map((t: { parameter: string }) => t.parameter).sort()).toEqual([
      "prize",
      "rivals.1.cost",
      "rivals.2.budget",
    ]);
    expect(out.sensitivity[0].payoffSwing).toHaveLength(3);
    for (const key of [
      "rival",
      "spend",
      "expectedPayoff",
      "p10Payoff",
      "meanRegret",
      "equilibriumSpendAtMedians",
    ]) {
      expect(out.plan).toHaveProperty(key);
    }
    expect(out.plan.rival).toBe("A");
    // C's spend is money, capped by its budget (uniform on [5, 30]) in every draw
    expect(out.spends.p90[2]).toBeLessThanOrEqual(30);
    expect(out.spends.p10[2]).toBeLessThan(out.spends.p90[2]);
  });

  it("main(uncertain) with the same seed is byte-identical; another seed differs", async () => {
    const withSeed = (seed: string) =>
      run("uncertain", "good.json", "--draws", "300", "--seed", seed, "--plan", "B", "--json");
    const a = await withSeed("11");
    const b = await withSeed("11");
    const c = await withSeed("12");
    expect(a.code).toBe(0);
    expect(b.stdout).toBe(a.stdout);
    expect(c.stdout).not.toBe(a.stdout);
    expect(JSON.parse(c.stdout).efforts.mean).not.toEqual(JSON.parse(a.stdout).efforts.mean);
  });

  it("main(uncertain FILE) prints a readable table with bands, tornado, plan and the cautions", async () => {
    const r = await run("uncertain", "good.json", "--draws", "200", "--plan", "C");
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/200 draws \(seed 1\)/);
    expect(r.stdout).toMatch(/P10 \/ P50 \/ P90/);
    expect(r.stdout).toMatch(/Tornado/);
    expect(r.stdout).toMatch(/Robust plan for C/);
    expect(r.stdout).toMatch(/equilibrium spend of the median scenario EUR/);
    expect(r.stdout).toMatch(/not a forecast/);
    expect(r.stdout).toMatch(/competitors/);
  });

  const bad: [string, string[], string][] = [
    ["badkind.json", [], "prize.dist"],
    ["lowhigh.json", [], "rivals.1.cost.high"],
    ["mode.json", [], "rivals.1.cost.high"],
    ["negcost.json", [], "rivals.1.cost.low"],
    ["negbudget.json", [], "rivals.2.budget.low"],
    ["extra.json", [], "rivals.0.value.mode"],
    ["good.json", ["--draws", "0"], "--draws"],
    ["good.json", ["--draws", "2.5"], "--draws"],
    ["good.json", ["--seed", "-1"], "--seed"],
    ["good.json", ["--plan", "Nobody"], "--plan"],
  ];
  for (const [file, extra, field] of bad) {
    it(`main(uncertain ${file} ${extra.join(" ")}) exits 2 naming ${field}`, async () => {
      const r = await run("uncertain", file, ...extra);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe("");
      expect(r.stderr).toContain(field);
      expect(r.stderr.trim().split("\n")).toHaveLength(1);
    });
  }
});
