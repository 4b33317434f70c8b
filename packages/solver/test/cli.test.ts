import { execFileSync, spawnSync } from "node:child_process";
import { readFile } from "node:fs/promises";
import { fileURLToPath } from "node:url";
import { beforeAll, describe, expect, it } from "vitest";
import { main, type CliIo } from "../src/cli/cli";

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
  "budget.json": JSON.stringify({
    ...good,
    rivals: [{ name: "One", cost: 1, budget: 10 }, good.rivals[1]],
  }),
};

async function run(...argv: string[]) {
  let stdout = "";
  let stderr = "";
  const io: CliIo = {
    stdout: { write: (s: string) => (stdout += s) },
    stderr: { write: (s: string) => (stderr += s) },
    readFile: async (path: string) => {
      if (path in files) return files[path]!;
      return readFile(path, "utf8");
    },
  };
  const code = await main(argv, io);
  return { code, stdout, stderr };
}

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
    expect(eq.active).toEqual([true, true]);
    expect(Array.isArray(out.alternatives)).toBe(true);
  });

  it("main(solve kiosk-lease.json) prints a readable table with totals and the cautions", async () => {
    const r = await run("solve", kioskPath);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain("Larkspur Bakehouse");
    expect(r.stdout).toMatch(/Total effort/);
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
      /Without commitment \(simultaneous game\): One 22\.2222, Two, Ltd 11\.1111/,
    );
    // Leader's optimum e1 = v m2 / (4 m1^2) = 50 while m2 < 2 m1 (Dixit 1987) sits at the boundary
    // m2 = 2 m1 here, where the follower is just pre-empted.
    expect(r.stdout).toMatch(/One\s+50\s/);
  });

  it("main(solve FILE with a binding budget) marks the capped rival", async () => {
    const r = await run("solve", "budget.json");
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/at budget/);
  });
});

describe("contend respond", () => {
  it("main(respond FILE --efforts 10,5 --json) gives best responses, regrets, payoffs, Nash gap", async () => {
    const r = await run("respond", "good.json", "--efforts", "10,5", "--json");
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual(["bestResponses", "regrets", "payoffs", "nashGap"]);
    // r = 1 best response sqrt(v Z / m) - Z (Tullock 1980): rival 1 vs Z = 5 -> sqrt(500) - 5.
    expect(out.bestResponses[0]).toBeCloseTo(Math.sqrt(500) - 5, 8);
    expect(out.bestResponses[1]).toBeCloseTo(Math.sqrt(500) - 10, 8);
    expect(out.payoffs[0]).toBeCloseTo((100 * 10) / 15 - 10, 10);
    expect(out.nashGap).toBeCloseTo(Math.max(...out.regrets), 12);
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
      'rivals.1.cost,effort:One,payoff:One,"effort:Two, Ltd","payoff:Two, Ltd",totalEffort,dissipation,kind',
    );
    const row = lines[1]!.split(",");
    expect(Number(row[0])).toBe(1);
    expect(Number(row[1])).toBeCloseTo(25, 9); // symmetric r = 1, n = 2: e = v/4 (Tullock 1980)
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
    ["missing efforts", ["respond", "good.json"], /--efforts: is required/],
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

  it("node dist/contend.mjs solve missing.json exits 2 with one stderr line", () => {
    const r = spawnSync("node", [bundle, "solve", `${pkg}missing.json`], { encoding: "utf8" });
    expect(r.status).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderr.trimEnd().split("\n")).toHaveLength(1);
  });
});
