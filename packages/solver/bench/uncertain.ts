/**
 * Uncertainty benchmark rows: the Monte Carlo of the equilibrium (`runUncertain`) and a sweep
 * with bands (`sweepBands`). Prints numbers, asserts nothing. Wall-clock medians and, because
 * the machine may be shared, the CPU time per run as well. Run alone with
 * `npx tsx bench/uncertain.ts` (in packages/solver; add `--cli` to also time the `contend
 * uncertain` command end to end); `bench/run.ts` includes these rows.
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { loadavg, tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { runUncertain, sweepBands } from "../src/uncertain";
import type { UncertainScenario } from "../src/uncertain";
import { time } from "./timer";

export interface UncertainRow {
  case: string;
  target: string;
  runs: number;
  medianMs: number;
  p95Ms: number;
  note?: string;
}

type Timer = typeof time;

/** n rivals, r = 1, every cost uniform on +-30% of its point value (as the CLI row reads it). */
export function rangedScenario(n: number): UncertainScenario {
  return {
    title: `${n} rivals, cost ranges`,
    prize: 1000,
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: Array.from({ length: n }, (_, i) => {
      const cost = 1 + (i % 37) / 40;
      return {
        name: `R${i}`,
        cost: { dist: "uniform" as const, low: 0.7 * cost, high: 1.3 * cost },
        value: 1000 * (1 + (i % 11) / 20),
        weight: 1 + (i % 5) / 10,
        budget: null,
        decisiveness: null,
      };
    }),
  };
}

function cpuMs(fn: () => unknown, runs: number): number {
  const c0 = process.cpuUsage();
  for (let r = 0; r < runs; r++) fn();
  const c = process.cpuUsage(c0);
  return (c.user + c.system) / 1000 / runs;
}

export function uncertainRows(time: Timer): UncertainRow[] {
  const rows: UncertainRow[] = [];
  const ranged = rangedScenario(10);
  const run = () => runUncertain(ranged, { draws: 10_000, seed: 1 });
  const t = time(run, { warmup: 2, runs: 7 });
  rows.push({
    case: "runUncertain 10,000 draws, 10 rivals, r = 1, 10 cost ranges (incl. tornado)",
    target: "< 200 ms",
    runs: 7,
    medianMs: t.median,
    p95Ms: t.p95,
    note: `mean CPU ${cpuMs(run, 5).toFixed(0)} ms per run`,
  });
  const plan = () => runUncertain(ranged, { draws: 10_000, seed: 1, planRival: 0 });
  const tp = time(plan, { warmup: 1, runs: 5 });
  rows.push({
    case: "same with a robust plan for one rival",
    target: "-",
    runs: 5,
    medianMs: tp.median,
    p95Ms: tp.p95,
    note: `mean CPU ${cpuMs(plan, 3).toFixed(0)} ms per run`,
  });
  const two: UncertainScenario = {
    title: "Two rivals, one cost range",
    prize: 100,
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: [
      { name: "A", cost: 1 },
      { name: "B", cost: { dist: "uniform", low: 1, high: 3 } },
    ],
  };
  const values = Array.from({ length: 41 }, (_, k) => 0.5 + k * 0.05);
  const bands = () => sweepBands(two, "rivals.0.cost", values, { draws: 400, seed: 1 });
  const tb = time(bands, { warmup: 1, runs: 5 });
  rows.push({
    case: "sweepBands, 2 rivals, 41 values x 400 draws (the explorer's sweep bands)",
    target: "-",
    runs: 5,
    medianMs: tb.median,
    p95Ms: tb.p95,
    note: `mean CPU ${cpuMs(bands, 3).toFixed(0)} ms per run; runs in the Web Worker`,
  });
  return rows;
}

/** Wall time of `contend uncertain FILE --draws 10000 --seed 1 --json`, with process start-up. */
function cliRow(): UncertainRow {
  const dir = mkdtempSync(path.join(tmpdir(), "contend-bench-"));
  const file = path.join(dir, "ranged.json");
  writeFileSync(file, JSON.stringify(rangedScenario(10)));
  const bin = fileURLToPath(new URL("../bin/contend.mjs", import.meta.url));
  const wall = (args: string[]) => {
    const t0 = performance.now();
    execFileSync(process.execPath, [bin, ...args], { stdio: "pipe" });
    return performance.now() - t0;
  };
  const med = (xs: number[]) => xs.sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
  const full = med(
    [0, 1, 2].map(() => wall(["uncertain", file, "--draws", "10000", "--seed", "1", "--json"])),
  );
  const start = med(
    [0, 1, 2].map(() => wall(["uncertain", file, "--draws", "1", "--seed", "1", "--json"])),
  );
  return {
    case: "contend uncertain, 10,000 draws, 10 rivals (process wall time)",
    target: "< 200 ms of work",
    runs: 3,
    medianMs: full,
    p95Ms: full,
    note: `the same with 1 draw (start-up, tsx, tornado): ${start.toFixed(0)} ms; difference ${(full - start).toFixed(0)} ms`,
  };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const rows = uncertainRows(time);
  if (process.argv.includes("--cli")) rows.push(cliRow());
  for (const r of rows) {
    console.log(
      `${r.case}: median ${r.medianMs.toFixed(1)} ms, p95 ${r.p95Ms.toFixed(1)} ms (target ${r.target}); ${r.note ?? ""}`,
    );
  }
  console.log(
    `load average ${loadavg()
      .map((x) => x.toFixed(1))
      .join(", ")}; ${new Date().toISOString()}`,
  );
}
