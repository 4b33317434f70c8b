/**
 * Calibration (src/calibrate): the log-centred least-squares fit of the ratio form (Cooper &
 * Nakanishi, Market-Share Analysis, 1988) and the revealed values from the first-order condition
 * (Tullock 1980), checked against panels generated from known scenarios and against a
 * general-purpose regression library.
 */
import MLR from "ml-regression-multivariate-linear";
import { describe, expect, it } from "vitest";
import {
  calibrate,
  indexPanel,
  mulberry32,
  normalize,
  solve,
  type PanelRow,
  type Rng,
  type Scenario,
} from "../src/index";
import { logCentredOls } from "../src/calibrate/logCentredOls";
import { studentTQuantile } from "../src/calibrate/studentT";

function relErr(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 === 1 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

interface Known {
  r: number;
  weights: number[];
  /** value of rival i in period t */
  value: (i: number, t: number) => number;
  periods: number;
}

/**
 * A panel at the Nash equilibrium of each period's scenario (cost 1, so spend = effort), with
 * the true value of every rival in every period. The solver's equilibrium is the generator; its
 * measured Nash gap is checked to be negligible so the panel really is made of best replies.
 */
function equilibriumPanel(k: Known): { rows: PanelRow[]; values: number[][] } {
  const rows: PanelRow[] = [];
  const values: number[][] = k.weights.map(() => []);
  let row = 2;
  for (let t = 0; t < k.periods; t++) {
    const scenario: Scenario = {
      title: `period ${t}`,
      prize: 1,
      csf: { kind: "ratio", decisiveness: k.r },
      rivals: k.weights.map((weight, i) => ({
        name: `Rival ${i + 1}`,
        cost: 1,
        weight,
        value: k.value(i, t),
      })),
    };
    const eq = solve(normalize(scenario)).equilibrium;
    expect(eq.kind).toBe("pure");
    const spendScale = Math.max(...eq.efforts!);
    expect(eq.nashGap).toBeLessThan(1e-12 * spendScale * 100);
    eq.efforts!.forEach((e, i) => {
      expect(e).toBeGreaterThan(0); // every rival active, so every row is usable
      rows.push({
        period: `Q${t + 1}`,
        rival: `Rival ${i + 1}`,
        spend: e,
        share: eq.shares![i]!,
        row: row++,
      });
      values[i]!.push(k.value(i, t));
    });
  }
  return { rows, values };
}

const KNOWN: [string, Known][] = [
  [
    "four rivals, r = 0.8, values moving with the period",
    {
      r: 0.8,
      weights: [1, 1.3, 0.7, 1.1],
      value: (i, t) => 1000 * (1 + 0.2 * i) * (1 + 0.3 * Math.sin(1.7 * t + i)),
      periods: 12,
    },
  ],
  [
    "three rivals, r = 1 (Hillman & Riley 1989 interior equilibrium)",
    {
      r: 1,
      weights: [1, 0.9, 1.2],
      value: (i, t) => 50_000 * (1 + 0.15 * Math.cos(t * (i + 1))) * (1 - 0.1 * i),
      periods: 8,
    },
  ],
  [
    "six rivals, r = 0.5, values trending apart",
    {
      r: 0.5,
      weights: [1, 2, 0.5, 1.5, 0.8, 1.25],
      value: (i, t) => 200 * (1 + 0.05 * i * t) * (1 + 0.2 * ((i * 7 + t * 3) % 5)),
      periods: 20,
    },
  ],
];

describe("calibrate: exact recovery at equilibrium panels (no noise)", () => {
  for (const [label, k] of KNOWN) {
    it(`${label}: r, head starts and every period's revealed value to 1e-9`, () => {
      const { rows, values } = equilibriumPanel(k);
      const res = calibrate(rows);
      if (!res.ok) throw new Error(`${res.path}: ${res.message}`);
      const c = res.value;
      expect(relErr(c.decisiveness.estimate, k.r)).toBeLessThan(1e-9);
      c.headStarts.forEach((h, i) => {
        expect(relErr(h.estimate, k.weights[i]! / k.weights[0]!)).toBeLessThan(1e-9);
      });
      expect(c.fit.r2).toBeGreaterThan(1 - 1e-12);
      expect(c.fit.dropped).toBe(0);
      expect(c.fit.observations).toBe(k.periods * k.weights.length);
      // per-period values first (the inversion), then the median over periods
      c.points.forEach((pts, i) => {
        expect(pts).toHaveLength(k.periods);
        for (const p of pts) {
          expect(relErr(p.revealedValue, values[i]![p.periodIndex]!)).toBeLessThan(1e-9);
        }
        expect(relErr(c.revealedValues[i]!.estimate, median(values[i]!))).toBeLessThan(1e-9);
      });
    });
  }
});

/** Standard normal by Box-Muller from a seeded uniform source. */
function normal(rng: Rng): number {
  const u = 1 - rng();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rng());
}

/**
 * A panel from known parameters with log-normal noise on the attraction:
 * q_it proportional to a_i s_it^r exp(sigma z_it), spends log-normal around per-rival levels.
 */
function noisyPanel(rng: Rng, r: number, weights: number[], periods: number, sigma: number) {
  const rows: PanelRow[] = [];
  let row = 2;
  for (let t = 0; t < periods; t++) {
    const spends = weights.map((_, i) => 100 * (1 + i) * Math.exp(0.6 * normal(rng)));
    const attraction = spends.map((s, i) => weights[i]! * s ** r * Math.exp(sigma * normal(rng)));
    const total = attraction.reduce((a, b) => a + b, 0);
    spends.forEach((s, i) => {
      rows.push({
        period: `P${t}`,
        rival: `R${i}`,
        spend: s,
        share: attraction[i]! / total,
        row: row++,
      });
    });
  }
  return rows;
}

describe("calibrate: noisy recovery", () => {
  it("the 95% interval for r covers the true r in 92-98% of 500 panels with log-normal noise", () => {
    const rng = mulberry32(20261204);
    const trueR = 0.7;
    const weights = [1, 1.5, 0.8, 1.2];
    let covered = 0;
    for (let k = 0; k < 500; k++) {
      const res = calibrate(noisyPanel(rng, trueR, weights, 10, 0.25), { resamples: 10 });
      if (!res.ok) throw new Error(`${res.path}: ${res.message}`);
      const d = res.value.decisiveness;
      if (d.low <= trueR && trueR <= d.high) covered += 1;
    }
    // 500 draws at 95%: standard error about 1%, so 92-98% is about three standard errors.
    expect(covered / 500).toBeGreaterThanOrEqual(0.92);
    expect(covered / 500).toBeLessThanOrEqual(0.98);
  });
});

describe("logCentredOls against ml-regression-multivariate-linear", () => {
  it("same coefficients (1e-9) on the explicit design of centred dummies and centred log spend; standard errors agree after the degrees-of-freedom correction", () => {
    const rng = mulberry32(7);
    const rows = noisyPanel(rng, 0.9, [1, 2, 0.6, 1.4, 0.9], 15, 0.3);
    // an unbalanced panel: drop some rivals from some periods (shares of the rest renormalised)
    const kept = rows.filter(
      (r) =>
        !(r.rival === "R3" && r.period.endsWith("2")) && !(r.rival === "R1" && r.period === "P5"),
    );
    const sums = new Map<string, number>();
    for (const r of kept) sums.set(r.period, (sums.get(r.period) ?? 0) + r.share);
    const panelRows = kept.map((r) => ({ ...r, share: r.share / sums.get(r.period)! }));
    const indexed = indexPanel(panelRows);
    if (!indexed.ok) throw new Error(indexed.message);
    const p = indexed.value;
    const fit = logCentredOls(p);
    if (!fit.ok) throw new Error(fit.message);

    // Explicit design: for each observation, centred dummies for rivals 2..N and centred log spend.
    const N = p.rivals.length;
    const X: number[][] = [];
    const y: number[][] = [];
    for (let k = 0; k + 1 < p.start.length; k++) {
      const a = p.start[k]!;
      const b = p.start[k + 1]!;
      const m = b - a;
      const present = Array.from({ length: N }, () => 0);
      let ly = 0;
      let lx = 0;
      for (let o = a; o < b; o++) {
        present[p.obsRival[o]!] = 1;
        ly += Math.log(p.share[o]!) / m;
        lx += Math.log(p.spend[o]!) / m;
      }
      for (let o = a; o < b; o++) {
        const row: number[] = [];
        for (let j = 1; j < N; j++) row.push((p.obsRival[o] === j ? 1 : 0) - present[j]! / m);
        row.push(Math.log(p.spend[o]!) - lx);
        X.push(row);
        y.push([Math.log(p.share[o]!) - ly]);
      }
    }
    const mlr = new MLR(X, y, { intercept: false, statistics: true });
    const w = mlr.weights.map((row) => row[0]!);
    for (let j = 1; j < N; j++)
      expect(Math.abs(fit.value.logHeadStart[j]! - w[j - 1]!)).toBeLessThan(1e-9);
    expect(Math.abs(fit.value.r - w[N - 1]!)).toBeLessThan(1e-9);
    // The library divides the residual sum of squares by n - (number of columns) = n - N; the
    // centring used one more degree per period, so ours divides by n - T - N.
    const n = X.length;
    const T = p.start.length - 1;
    const scale = (n - N) / (n - T - N);
    for (let j = 0; j < N; j++) {
      const ours = Math.sqrt(fit.value.covariance[j * N + j]!);
      expect(relErr(ours, mlr.stdErrors[j]! * Math.sqrt(scale))).toBeLessThan(1e-9);
    }
  });
});

describe("calibrate: intervals", () => {
  it("the r interval is estimate -/+ t(0.975, n - T - N) x standard error, and head-start intervals are exp of the log-scale interval", () => {
    const rows = noisyPanel(mulberry32(11), 0.6, [1, 0.5, 2], 9, 0.2);
    const res = calibrate(rows, { resamples: 50 });
    if (!res.ok) throw new Error(res.message);
    const c = res.value;
    expect(c.fit.residualDf).toBe(27 - 9 - 3);
    const tq = studentTQuantile(0.975, 15);
    expect(c.decisiveness.high - c.decisiveness.estimate).toBeCloseTo(
      tq * c.decisiveness.standardError,
      12,
    );
    expect(c.decisiveness.estimate - c.decisiveness.low).toBeCloseTo(
      tq * c.decisiveness.standardError,
      12,
    );
    for (const h of c.headStarts.slice(1)) {
      // symmetric on the log scale
      expect(Math.log(h.high) - Math.log(h.estimate)).toBeCloseTo(
        Math.log(h.estimate) - Math.log(h.low),
        12,
      );
      expect(h.low).toBeLessThan(h.estimate);
    }
    expect(c.headStarts[0]).toEqual({ rival: "R0", estimate: 1, low: 1, high: 1 });
  });

  it("the bootstrap is seeded: the same seed gives the same interval, another seed another one; the interval holds the median", () => {
    const rows = noisyPanel(mulberry32(3), 0.8, [1, 1.2, 0.9], 12, 0.3);
    const a = calibrate(rows, { seed: 5, resamples: 400 });
    const b = calibrate(rows, { seed: 5, resamples: 400 });
    const c = calibrate(rows, { seed: 6, resamples: 400 });
    if (!a.ok || !b.ok || !c.ok) throw new Error("fit failed");
    expect(b.value.revealedValues).toEqual(a.value.revealedValues);
    expect(c.value.revealedValues).not.toEqual(a.value.revealedValues);
    for (const v of a.value.revealedValues) {
      expect(v.low).toBeLessThanOrEqual(v.estimate);
      expect(v.high).toBeGreaterThanOrEqual(v.estimate);
      expect(v.high).toBeGreaterThan(v.low);
    }
  });
});
