/**
 * `contend fit` (src/cli/fitCommand.ts) through main(): the documented JSON shape, a scenario that
 * `contend solve` accepts, the readable table with its cautions, and bad input exiting 2 with one
 * line naming the row or column and nothing on stdout.
 */
import { readFile } from "node:fs/promises";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { cliRunner } from "./cliRun";
import { validateScenario } from "../src/index";

const pkg = fileURLToPath(new URL("..", import.meta.url));
const demo = `${pkg}scenarios/regional-bakeries.csv`;

const files: Record<string, string> = {
  "nocol.csv": "period,rival,spend\nA,X,1\n",
  "negspend.csv": "period,rival,spend,share\nA,X,-1,0.5\nA,Y,1,0.5\n",
  "sums.csv":
    "period,rival,spend,share\nA,X,1,50%\nA,Y,2,45%\nB,X,2,50%\nB,Y,1,50%\nC,X,1,50%\nC,Y,1,50%\n",
};

const run = cliRunner(files);

describe("contend fit", () => {
  it("--json prints exactly the documented fields, rivals in first-appearance order", async () => {
    const r = await run("fit", demo, "--json");
    expect(r.code).toBe(0);
    expect(r.stderr).toBe("");
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual([
      "form",
      "decisiveness",
      "headStarts",
      "revealedValues",
      "fit",
      "scenario",
    ]);
    expect(out.form).toBe("ratio");
    expect(Object.keys(out.decisiveness)).toEqual(["estimate", "low", "high"]);
    const names = [
      "Larkspur Bakehouse",
      "Millstone Loaves",
      "Hearth & Crumb",
      "Copperpan Patisserie",
    ];
    expect(out.headStarts.map((h: { rival: string }) => h.rival)).toEqual(names);
    expect(out.revealedValues.map((h: { rival: string }) => h.rival)).toEqual(names);
    for (const h of [...out.headStarts, ...out.revealedValues]) {
      expect(Object.keys(h)).toEqual(["rival", "estimate", "low", "high"]);
    }
    expect(out.headStarts[0]).toEqual({ rival: names[0], estimate: 1, low: 1, high: 1 });
    expect(Object.keys(out.fit)).toEqual(["r2", "rmse", "observations", "periods", "dropped"]);
    expect(out.fit).toMatchObject({ observations: 48, periods: 12, dropped: 0 });
    expect(out.decisiveness.low).toBeLessThan(out.decisiveness.estimate);
    expect(out.decisiveness.high).toBeGreaterThan(out.decisiveness.estimate);
  });

  it("the scenario is one contend solve accepts: cost 1, weight = head start, value = revealed value, prize = the largest, r = r-hat, provenance kept", async () => {
    const out = JSON.parse((await run("fit", demo, "--json")).stdout);
    const sc = out.scenario;
    const v = validateScenario(sc);
    expect(v.ok).toBe(true);
    expect(sc.csf).toEqual({ kind: "ratio", decisiveness: out.decisiveness.estimate });
    expect(sc.prize).toBe(
      Math.max(...out.revealedValues.map((x: { estimate: number }) => x.estimate)),
    );
    sc.rivals.forEach(
      (rv: { name: string; cost: number; weight: number; value: number }, i: number) => {
        expect(rv).toEqual({
          name: out.headStarts[i].rival,
          cost: 1,
          value: out.revealedValues[i].estimate,
          weight: out.headStarts[i].estimate,
        });
      },
    );
    expect(sc.provenance).toMatchObject({ kind: "calibration", source: "regional-bakeries.csv" });
    files["calibrated.json"] = JSON.stringify(sc);
    const solved = await run("solve", "calibrated.json", "--json");
    expect(solved.code).toBe(0);
    expect(JSON.parse(solved.stdout).equilibrium.kind).toBe("pure");
  });

  it("--seed fixes the bootstrap: same seed, same output; another seed moves the value intervals only", async () => {
    const a = await run("fit", demo, "--json", "--seed", "9", "--resamples", "300");
    const b = await run("fit", demo, "--json", "--seed", "9", "--resamples", "300");
    const c = JSON.parse(
      (await run("fit", demo, "--json", "--seed", "10", "--resamples", "300")).stdout,
    );
    expect(b.stdout).toBe(a.stdout);
    const ja = JSON.parse(a.stdout);
    expect(c.decisiveness).toEqual(ja.decisiveness);
    expect(c.revealedValues.map((x: { estimate: number }) => x.estimate)).toEqual(
      ja.revealedValues.map((x: { estimate: number }) => x.estimate),
    );
    expect(c.revealedValues).not.toEqual(ja.revealedValues);
  });

  it("without --json prints a table with intervals, fit quality and the cautions", async () => {
    const r = await run("fit", demo);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(
      /Decisiveness r = [\d.]+ \(95% interval [\d.]+ to [\d.]+; 32 residual degrees of freedom\)/,
    );
    expect(r.stdout).toMatch(
      /Millstone Loaves +[\d.]+ +[\d.]+ to [\d.]+ +[\d,]+ +[\d,]+ to [\d,]+/,
    );
    expect(r.stdout).toContain("R^2");
    expect(r.stdout).toContain("best replies");
    expect(r.stdout).toContain("Jia, Skaperdas & Vaidya 2013");
    expect(r.stdout).toContain("never share effort plans");
  });

  const bad: [string, string[], RegExp][] = [
    [
      "missing column",
      ["fit", "nocol.csv"],
      /^contend: nocol\.csv: column share: is missing from the header/,
    ],
    [
      "negative spend",
      ["fit", "negspend.csv"],
      /^contend: negspend\.csv: row 2, column spend: must be >= 0/,
    ],
    [
      "shares off",
      ["fit", "sums.csv"],
      /^contend: sums\.csv: period "A" \(rows 2, 3\): shares sum to 0\.95/,
    ],
    [
      "missing file",
      ["fit", "nope.csv"],
      /^contend: nope\.csv: cannot read data file \(no such file\)/,
    ],
    ["no file", ["fit"], /^contend: FILE: fit needs a data file\n$/],
    ["bad seed", ["fit", demo, "--seed", "x"], /^contend: --seed: must be a whole number/],
    [
      "resamples out of range",
      ["fit", demo, "--resamples", "0"],
      /--resamples: must be an integer from 1 to 100000/,
    ],
    ["unknown option", ["fit", demo, "--steps", "3"], /^contend: --steps: unknown option/],
  ];
  for (const [label, argv, line] of bad) {
    it(`${label}: exit 2, one line on stderr, nothing on stdout`, async () => {
      const r = await run(...argv, "--json");
      expect(r.code).toBe(2);
      expect(r.stdout).toBe("");
      expect(r.stderr.endsWith("\n")).toBe(true);
      expect(r.stderr.trimEnd().split("\n")).toHaveLength(1);
      expect(r.stderr).toMatch(line);
    });
  }
});

describe("DEMO_PANEL", () => {
  it("is the text of scenarios/regional-bakeries.csv", async () => {
    const { DEMO_PANEL } = await import("../src/index");
    expect(DEMO_PANEL.csv).toBe(await readFile(demo, "utf8"));
  });
});
