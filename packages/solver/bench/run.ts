/**
 * Solver benchmarks: prints numbers, asserts nothing. Median and 95th percentile over repeated
 * runs after warm-up. `--json` prints the same rows as JSON.
 *   npx tsx bench/run.ts [--json]
 */
import { nelderMead } from "fmin/src/nelderMead.js";
import {
  hillmanRileyEquilibrium,
  nashGap,
  normalize,
  shareFunctionEquilibrium,
  solve,
  sweep2d,
  type Contest,
  type Scenario,
} from "../src/index";
import { calibrationBench } from "./calibrate";
import { mixedBench } from "./mixed";
import { time } from "./timer";
import { frontsRows } from "./fronts";
import { uncertainRows } from "./uncertain";

interface Row {
  case: string;
  target: string;
  runs: number;
  medianMs: number;
  p95Ms: number;
  note?: string;
}

function ratioScenario(n: number, opts: { budgets?: boolean; mixedR?: boolean } = {}): Scenario {
  return {
    title: `${n} rivals`,
    prize: 1000,
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: Array.from({ length: n }, (_, i) => ({
      name: `R${i}`,
      cost: 1 + (i % 37) / 40,
      value: 1000 * (1 + (i % 11) / 20),
      weight: 1 + (i % 5) / 10,
      budget: opts.budgets && i % 3 === 0 ? 0.2 + (i % 7) / 10 : null,
      decisiveness: opts.mixedR ? [0.5, 0.75, 1][i % 3]! : null,
    })),
  };
}

/**
 * The same equilibrium by a general-purpose optimiser: Nelder-Mead (fmin) on the squared
 * Fischer-Burmeister residual of the first-order conditions e_i >= 0, F_i >= 0, e_i F_i = 0 with
 * F_i = m_i - v_i w_i (Y - w_i e_i) / Y^2 (ratio form, r = 1). Efforts enter as |z_i| so the
 * search is unconstrained; up to four restarts. Independent of the solver's own code.
 */
// fmin 0.0.4's shrink step assigns an undeclared loop variable `i`, which throws under the strict
// mode of ES modules; a global of that name makes the assignment legal without touching the library.
(globalThis as Record<string, unknown>).i = 0;

function nelderMeadEquilibrium(contest: Contest): number[] {
  const rs = contest.rivals;
  const scale = contest.prize / rs.length;
  const residual = (z: number[]) => {
    const e = z.map((x) => Math.abs(x) * scale);
    let Y = 0;
    for (let i = 0; i < rs.length; i++) Y += rs[i]!.weight * e[i]!;
    if (Y <= 0) return 1e6;
    let sum = 0;
    for (let i = 0; i < rs.length; i++) {
      const r = rs[i]!;
      const a = e[i]! / scale;
      const b = (r.cost - (r.value * r.weight * (Y - r.weight * e[i]!)) / (Y * Y)) / r.cost;
      const fb = a + b - Math.hypot(a, b);
      sum += fb * fb;
    }
    return sum;
  };
  // Restarting from the best point rebuilds a collapsed simplex (common practice, no source).
  let best = nelderMead(
    residual,
    rs.map(() => 0.3),
    { maxIterations: 2000 * rs.length, minErrorDelta: 1e-14 },
  );
  for (let restart = 0; restart < 4; restart++) {
    const next = nelderMead(residual, best.x.slice(), {
      maxIterations: 2000 * rs.length,
      minErrorDelta: 1e-14,
    });
    if (next.fx >= best.fx) break;
    best = next;
  }
  return best.x.map((x) => Math.abs(x) * scale);
}

function main() {
  const json = process.argv.includes("--json");
  const rows: Row[] = [];

  const big = normalize(ratioScenario(10_000));
  const t1 = time(() => hillmanRileyEquilibrium(big), { warmup: 20, runs: 100 });
  rows.push({
    case: "closed form (Hillman-Riley), 10,000 rivals",
    target: "< 5 ms",
    runs: 100,
    medianMs: t1.median,
    p95Ms: t1.p95,
  });
  const t1s = time(() => solve(big), { warmup: 2, runs: 10 });
  rows.push({
    case: "solve() end to end, 10,000 rivals (incl. Nash gap check)",
    target: "-",
    runs: 10,
    medianMs: t1s.median,
    p95Ms: t1s.p95,
    note: solve(big).equilibrium.method,
  });

  const mixed = normalize(ratioScenario(1000, { budgets: true, mixedR: true }));
  const t2 = time(() => shareFunctionEquilibrium(mixed), { warmup: 10, runs: 50 });
  rows.push({
    case: "share-function method, 1,000 rivals, budgets, r_i in {0.5, 0.75, 1}",
    target: "< 20 ms",
    runs: 50,
    medianMs: t2.median,
    p95Ms: t2.p95,
  });
  const t2s = time(() => solve(mixed), { warmup: 2, runs: 10 });
  const mixedEq = solve(mixed).equilibrium;
  rows.push({
    case: "solve() end to end, same 1,000 rivals (incl. Nash gap check)",
    target: "-",
    runs: 10,
    medianMs: t2s.median,
    p95Ms: t2s.p95,
    note: `${mixedEq.method}, Nash gap ${mixedEq.nashGap.toExponential(2)}`,
  });

  const five = ratioScenario(5);
  const grid = {
    x: { param: "rivals.0.cost", from: 0.5, to: 3, steps: 100 },
    y: { param: "rivals.1.cost", from: 0.5, to: 3, steps: 100 },
  };
  const t3 = time(() => sweep2d(five, grid), { warmup: 1, runs: 7 });
  rows.push({
    case: "sweep2d 100 x 100, 5 rivals, r = 1",
    target: "< 500 ms",
    runs: 7,
    medianMs: t3.median,
    p95Ms: t3.p95,
  });

  for (const n of [5, 20]) {
    const c = normalize(ratioScenario(n));
    const ours = solve(c).equilibrium.efforts!;
    const runs = n === 5 ? 20 : 5;
    const tOurs = time(() => solve(c), { warmup: 5, runs: 50 });
    const tNm = time(() => nelderMeadEquilibrium(c), { warmup: 1, runs });
    const nm = nelderMeadEquilibrium(c);
    const maxE = Math.max(...ours);
    const err = Math.max(...nm.map((e, i) => Math.abs(e - ours[i]!))) / maxE;
    const gap = nashGap(c, nm) / c.prize;
    rows.push({
      case: `fmin Nelder-Mead on the FOC residual, ${n} rivals`,
      target: "-",
      runs,
      medianMs: tNm.median,
      p95Ms: tNm.p95,
      note: `${(tNm.median / tOurs.median).toFixed(0)}x slower than solve() (${tOurs.median.toFixed(3)} ms); max effort error ${err.toExponential(2)} of the largest effort; its Nash gap ${gap.toExponential(2)} of the prize`,
    });
  }

  rows.push(...uncertainRows(time));
  rows.push(...calibrationBench(time));
  rows.push(...mixedBench(time));
  rows.push(...frontsRows(time));

  if (json) {
    process.stdout.write(`${JSON.stringify(rows, null, 2)}\n`);
    return;
  }
  const header = ["case", "target", "runs", "median ms", "p95 ms", "note"];
  const body = rows.map((r) => [
    r.case,
    r.target,
    String(r.runs),
    r.medianMs.toFixed(3),
    r.p95Ms.toFixed(3),
    r.note ?? "",
  ]);
  const widths = header.map((h, c) => Math.max(h.length, ...body.map((b) => b[c]!.length)));
  const line = (cells: string[]) =>
    cells
      .map((x, c) => x.padEnd(widths[c]!))
      .join("  ")
      .trimEnd();
  console.log(line(header));
  console.log(widths.map((w) => "-".repeat(w)).join("  "));
  for (const b of body) console.log(line(b));
  console.log(`\nNode ${process.version}, ${new Date().toISOString()}`);
}

main();
