import { execFileSync, spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { beforeAll, describe, expect, it } from "vitest";
import { cliRunner } from "./cliRun";

const pkg = fileURLToPath(new URL("..", import.meta.url));
const kioskPath = `${pkg}scenarios/kiosk-lease.json`;

const good = {
  title: "Two rivals",
  prize: 100,
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "One", cost: 1 },
    { name: "Two, Ltd", cost: 2 },
  ],
};

const files: Record<string, string> = {
  "good.json": JSON.stringify(good),
  "broken.json": '{"title": "x", ',
  "unknown.json": JSON.stringify({ ...good, colour: "red" }),
  "negcost.json": JSON.stringify({ ...good, rivals: [{ name: "One", cost: -1 }, good.rivals[1]] }),
  "infcost.json":
    '{"title":"x","prize":1,"csf":{"kind":"ratio","decisiveness":1},"rivals":[{"name":"A","cost":1e999}]}',
  "norivals.json": JSON.stringify({ ...good, rivals: [] }),
  "negbudget.json": JSON.stringify({
    ...good,
    rivals: [{ name: "One", cost: 1, budget: -5 }, good.rivals[1]],
  }),
  "decisive.json": JSON.stringify({ ...good, csf: { kind: "ratio", decisiveness: 50 } }),
  "leader.json": JSON.stringify({ ...good, leader: "One" }),
  "budget2.json": JSON.stringify({
    ...good,
    rivals: [{ name: "One", cost: 2, budget: 10 }, good.rivals[1]],
  }),
  "budget.json": JSON.stringify({
    ...good,
    rivals: [{ name: "One", cost: 1, budget: 10 }, good.rivals[1]],
  }),
};

const run = cliRunner(files);

describe("contend solve", () => {
  it("main(solve FILE --json) prints the equilibrium in the documented shape", async () => {
    const r = await run("solve", "good.json", "--json");
    expect(r.code).toBe(0);
    expect(r.stderr).toBe("");
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual(["equilibrium", "alternatives"]);
    const eq = out.equilibrium;
    for (const key of [
      "kind",
      "efforts",
      "spends",
      "shares",
      "payoffs",
      "totalEffort",
      "dissipation",
      "active",
      "nashGap",
    ]) {
      expect(eq).toHaveProperty(key);
    }
    expect(eq.kind).toBe("pure");
    // Hillman & Riley 1989, two rivals, common v: e1 = v m2 / (m1 + m2)^2 = 200/9, e2 = 100/9.
    expect(eq.efforts[0]).toBeCloseTo(200 / 9, 9);
    expect(eq.efforts[1]).toBeCloseTo(100 / 9, 9);
    // spends are money: cost x effort = 1 x 200/9 and 2 x 100/9 (equal spends at r = 1, n = 2)
    expect(eq.spends[0]).toBeCloseTo(200 / 9, 9);
    expect(eq.spends[1]).toBeCloseTo(200 / 9, 9);
    expect(eq.totalSpend).toBeCloseTo(400 / 9, 9);
    expect(eq.active).toEqual([true, true]);
    expect(Array.isArray(out.alternatives)).toBe(true);
  });

  it("main(solve kiosk-lease.json) prints a readable table with totals and the cautions", async () => {
    const r = await run("solve", kioskPath);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain("Larkspur Bakehouse");
    expect(r.stdout).toMatch(/Total spend EUR /);
    expect(r.stdout).toMatch(/Spend is money \(cost x effort\)/);
    expect(r.stdout).toMatch(/dissipation/);
    expect(r.stdout).toMatch(/Nash gap/);
    expect(r.stdout).toMatch(/method: /);
    expect(r.stdout).toMatch(/not a forecast/);
    expect(r.stdout).toMatch(/competitors/);
    expect(r.stdout).toMatch(/counsel/);
  });

  it("main(solve FILE with leader) says who commits first", async () => {
    const r = await run("solve", "leader.json");
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/One commits first/);
    // Simultaneous game for comparison: e1 = v m2 / (m1 + m2)^2 = 200/9 = 22.2222 (Hillman & Riley 1989).
    expect(r.stdout).toMatch(
      /Without commitment \(simultaneous game\): One spends 22\.2222, Two, Ltd spends 22\.2222/,
    );
    // Leader's optimum e1 = v m2 / (4 m1^2) = 50 while m2 < 2 m1 (Dixit 1987) sits at the boundary
    // m2 = 2 m1 here, where the follower is just pre-empted.
    expect(r.stdout).toMatch(/One\s+50\s+50\s/); // spend 50 at cost 1, effort 50
  });

  it("main(solve FILE with a binding budget) marks the capped rival", async () => {
    const r = await run("solve", "budget.json");
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/at budget/);
  });

  it("main(solve, budget 10 at cost 2) caps money: spend 10, effort 5", async () => {
    const r = await run("solve", "budget2.json", "--json");
    expect(r.code).toBe(0);
    const eq = JSON.parse(r.stdout).equilibrium;
    // Unconstrained (Hillman & Riley 1989) rival 1 would spend 2 x v m2 / (m1 + m2)^2 = 200/9 > 10.
    expect(eq.spends[0]).toBeCloseTo(10, 9);
    expect(eq.efforts[0]).toBeCloseTo(5, 9);
    // Che & Gale 1997: the other replies to the capped effort, sqrt(v e1 / m2) - e1 (m2 = 2).
    expect(eq.efforts[1]).toBeCloseTo(Math.sqrt((100 * 5) / 2) - 5, 7);
  });
});

describe("contend respond", () => {
  it("main(respond FILE --efforts 10,5 --json) gives best responses, regrets, payoffs, Nash gap", async () => {
    const r = await run("respond", "good.json", "--efforts", "10,5", "--json");
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual([
      "efforts",
      "spends",
      "bestResponses",
      "bestResponseSpends",
      "regrets",
      "payoffs",
      "nashGap",
    ]);
    expect(out.spends).toEqual([10, 10]); // cost 2 x effort 5
    expect(out.bestResponseSpends[1]).toBeCloseTo(2 * (Math.sqrt(500) - 10), 8);
    // r = 1 best response sqrt(v Z / m) - Z (Tullock 1980): rival 1 vs Z = 5 -> sqrt(500) - 5.
    expect(out.bestResponses[0]).toBeCloseTo(Math.sqrt(500) - 5, 8);
    expect(out.bestResponses[1]).toBeCloseTo(Math.sqrt(500) - 10, 8);
    expect(out.payoffs[0]).toBeCloseTo((100 * 10) / 15 - 10, 10);
    expect(out.nashGap).toBeCloseTo(Math.max(...out.regrets), 12);
  });

  it("main(respond FILE --spends 10,10) reads money: effort = spend / cost", async () => {
    const bySpend = JSON.parse(
      (await run("respond", "good.json", "--spends", "10,10", "--json")).stdout,
    );
    const byEffort = JSON.parse(
      (await run("respond", "good.json", "--efforts", "10,5", "--json")).stdout,
    );
    expect(bySpend.efforts).toEqual([10, 5]);
    expect(bySpend).toEqual(byEffort);
    const over = await run("respond", "budget2.json", "--spends", "11,1");
    expect(over.code).toBe(2);
    expect(over.stderr).toMatch(/--spends: spend 1 \(One\) is more than its budget 10/);
    // effort 6 at cost 2 costs 12 > 10 (read as an effort cap, 6 would have passed)
    const overEffort = await run("respond", "budget2.json", "--efforts", "6,1");
    expect(overEffort.stderr).toMatch(
      /--efforts: effort 1 \(One\) costs 12, more than its budget 10/,
    );
  });

  it("main(respond FILE --efforts at equilibrium) reports a zero Nash gap in the table", async () => {
    const r = await run("respond", "good.json", `--efforts=${200 / 9},${100 / 9}`);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/this profile is an equilibrium/);
    expect(r.stdout).toMatch(/not a forecast/);
  });
});

describe("contend sweep", () => {
  it("main(sweep FILE ...) prints CSV with a header per rival", async () => {
    const r = await run(
      "sweep",
      "good.json",
      "--param",
      "rivals.1.cost",
      "--from",
      "1",
      "--to",
      "3",
      "--steps",
      "5",
    );
    expect(r.code).toBe(0);
    const lines = r.stdout.trim().split("\n");
    expect(lines).toHaveLength(6);
    expect(lines[0]).toBe(
      'rivals.1.cost,spend:One,effort:One,payoff:One,"spend:Two, Ltd","effort:Two, Ltd","payoff:Two, Ltd",totalSpend,totalEffort,dissipation,kind',
    );
    const row = lines[1]!.split(",");
    expect(Number(row[0])).toBe(1);
    expect(Number(row[2])).toBeCloseTo(25, 9); // symmetric r = 1, n = 2: e = v/4 (Tullock 1980)
    // last row: cost of Two is 3; Hillman & Riley 1989 e2 = v m1 / (m1 + m2)^2 = 100/16, spend 3 x that
    const last = lines[5]!.split(",");
    expect(Number(last[4])).toBeCloseTo((3 * 100) / 16, 9);
    expect(Number(last[5])).toBeCloseTo(100 / 16, 9);
    expect(row.at(-1)).toBe("pure");
  });

  it("main(sweep FILE ... --json) prints plot-ready series", async () => {
    const r = await run(
      "sweep",
      "good.json",
      "--param",
      "prize",
      "--from",
      "50",
      "--to",
      "150",
      "--steps",
      "3",
      "--json",
    );
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.values).toEqual([50, 100, 150]);
    expect(out.efforts).toHaveLength(2);
    expect(out.spends[1][1]).toBeCloseTo(2 * out.efforts[1][1], 12); // Two's cost is 2
    expect(out.kinds).toEqual(["pure", "pure", "pure"]);
  });
});

describe("contend statics and help", () => {
  it("main(statics FILE --json) lists analytic rows", async () => {
    const r = await run("statics", "good.json", "--json");
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.rows.find((x: { param: string }) => x.param === "rivals.1.cost").method).toBe(
      "analytic",
    );
  });

  it("main(--help) prints usage on stdout", async () => {
    const r = await run("--help");
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/contend solve FILE/);
    expect((await run("sweep", "--help")).stdout).toMatch(/--param PATH/);
  });
});

describe("contend bad input", () => {
  const cases: [string, string[], RegExp][] = [
    ["missing file", ["solve", "nope.json"], /nope\.json.*no such file/],
    ["malformed JSON", ["solve", "broken.json"], /not valid JSON/],
    ["unknown field", ["solve", "unknown.json"], /colour/],
    ["negative cost", ["solve", "negcost.json"], /rivals\.0\.cost/],
    ["non-finite cost", ["solve", "infcost.json"], /rivals\.0\.cost.*finite/],
    ["no rivals", ["solve", "norivals.json"], /rivals: must have 1/],
    ["budget < 0", ["respond", "negbudget.json", "--efforts", "1,1"], /rivals\.0\.budget/],
    ["decisiveness out of range", ["solve", "decisive.json"], /csf\.decisiveness/],
    ["no command", [], /missing command/],
    ["unknown command", ["optimise", "good.json"], /unknown command/],
    ["unknown flag", ["solve", "good.json", "--fast"], /--fast/],
    ["flag of another command", ["solve", "good.json", "--efforts", "1,2"], /--efforts/],
    ["no file", ["solve"], /FILE/],
    ["two files", ["solve", "good.json", "good.json"], /unexpected argument/],
    ["boolean with value", ["solve", "good.json", "--json=yes"], /--json/],
    ["missing spends", ["respond", "good.json"], /--spends: is required/],
    [
      "spends and efforts",
      ["respond", "good.json", "--spends", "1,1", "--efforts", "1,1"],
      /--efforts: give --spends or --efforts, not both/,
    ],
    ["wrong effort count", ["respond", "good.json", "--efforts", "1,2,3"], /--efforts: expected 2/],
    ["negative effort", ["respond", "good.json", "--efforts", "1,-2"], /--efforts: effort 2.*>= 0/],
    [
      "non-numeric effort",
      ["respond", "good.json", "--efforts", "1,abc"],
      /--efforts: effort 2.*not a finite number/,
    ],
    [
      "effort over budget",
      ["respond", "budget.json", "--efforts", "11,1"],
      /--efforts: effort 1.*budget/,
    ],
    [
      "missing sweep flag",
      ["sweep", "good.json", "--param", "prize", "--from", "1", "--to", "2"],
      /--steps/,
    ],
    [
      "bad sweep path",
      [
        "sweep",
        "good.json",
        "--param",
        "rivals.7.cost",
        "--from",
        "1",
        "--to",
        "2",
        "--steps",
        "3",
      ],
      /--param/,
    ],
    [
      "bad sweep number",
      ["sweep", "good.json", "--param", "prize", "--from", "x", "--to", "2", "--steps", "3"],
      /--from/,
    ],
    [
      "fractional steps",
      ["sweep", "good.json", "--param", "prize", "--from", "1", "--to", "2", "--steps", "2.5"],
      /--steps/,
    ],
    [
      "sweep into invalid values",
      ["sweep", "good.json", "--param", "prize", "--from", "-1", "--to", "2", "--steps", "3"],
      /--from: prize/,
    ],
    ["flag without value", ["sweep", "good.json", "--param"], /--param: needs a value/],
  ];
  for (const [label, argv, pattern] of cases) {
    it(`main(${label}) exits 2 with one stderr line and nothing on stdout`, async () => {
      const r = await run(...argv);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe("");
      expect(r.stderr).toMatch(pattern);
      expect(r.stderr.endsWith("\n")).toBe(true);
      expect(r.stderr.trimEnd().split("\n")).toHaveLength(1);
    });
  }
});

describe("contend bundle", () => {
  const bundle = `${pkg}dist/contend.mjs`;
  beforeAll(() => {
    execFileSync("npm", ["run", "build", "--silent"], { cwd: pkg, stdio: "pipe" });
  }, 60_000);

  it("node dist/contend.mjs solve kiosk-lease.json --json exits 0 with JSON", () => {
    const r = spawnSync("node", [bundle, "solve", kioskPath, "--json"], { encoding: "utf8" });
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).equilibrium.kind).toBe("pure");
  });

  it("node dist/contend.mjs fit regional-bakeries.csv --json exits 0 (papaparse is bundled)", () => {
    const csvPath = `${pkg}scenarios/regional-bakeries.csv`;
    const r = spawnSync("node", [bundle, "fit", csvPath, "--json"], { encoding: "utf8" });
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).form).toBe("ratio");
  });

  it("node dist/contend.mjs solve missing.json exits 2 with one stderr line", () => {
    const r = spawnSync("node", [bundle, "solve", `${pkg}missing.json`], { encoding: "utf8" });
    expect(r.status).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderr.trimEnd().split("\n")).toHaveLength(1);
  });
});
