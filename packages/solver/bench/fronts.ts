/**
 * Fronts benchmark rows: several contests, one budget per rival. Prints numbers, asserts
 * nothing. Run alone with `npx tsx bench/fronts.ts`; `bench/run.ts` includes these rows.
 */
import { normalizeFronts, solveFronts, validateFrontsScenario } from "../src/fronts";
import type { FrontsContest, FrontsScenario } from "../src/fronts/types";
import { time } from "./timer";

export interface FrontsRow {
  case: string;
  target: string;
  runs: number;
  medianMs: number;
  p95Ms: number;
  note?: string;
}

type Timer = typeof time;

/**
 * n rivals x K fronts, r in {1, 0.8, 0.6} by front (the first `allPay` fronts all-pay instead);
 * 3 in 4 rivals with budgets, a third of those sunk.
 */
export function frontsScenario(n: number, K: number, allPay = 0): FrontsContest {
  const s: FrontsScenario = {
    title: `${n} rivals x ${K} fronts`,
    fronts: Array.from({ length: K }, (_, k) => ({
      name: `F${k}`,
      prize: 100 + 37 * ((k * 7) % 11),
      csf:
        k < allPay
          ? { kind: "allpay" as const }
          : { kind: "ratio" as const, decisiveness: [1, 0.8, 0.6][k % 3]! },
    })),
    rivals: Array.from({ length: n }, (_, i) => ({
      name: `R${i}`,
      cost: Array.from({ length: K }, (_, k) => 1 + ((i * 3 + k * 5) % 7) / 10),
      weight: Array.from({ length: K }, (_, k) => 1 + ((i + 2 * k) % 4) / 8),
      budget: i % 4 === 3 ? null : 150 + 60 * (i % 5),
      sunkBudget: i % 4 === 1,
    })),
  };
  const v = validateFrontsScenario(s);
  if (!v.ok) throw new Error(`${v.path}: ${v.message}`);
  return normalizeFronts(v.value);
}

export function frontsRows(time: Timer): FrontsRow[] {
  const rows: FrontsRow[] = [];
  for (const [n, K, allPay, target] of [
    [10, 20, 0, "< 100 ms"],
    [3, 4, 0, "-"],
    [3, 4, 2, "-"],
  ] as const) {
    const c = frontsScenario(n, K, allPay);
    const eq = solveFronts(c).equilibrium;
    const binding = (eq.shadowPrices ?? []).filter((x) => x !== null && x > 0).length;
    const t = time(() => solveFronts(c), { warmup: 3, runs: 15 });
    // CPU time per solve as well: on a shared machine wall-clock figures include waiting
    const cpu0 = process.cpuUsage();
    for (let r = 0; r < 15; r++) solveFronts(c);
    const cpu = process.cpuUsage(cpu0);
    const cpuMs = (cpu.user + cpu.system) / 1000 / 15;
    rows.push({
      case: `solveFronts, ${n} rivals x ${K} fronts${allPay ? ` (${allPay} all-pay)` : ""}, budgets (incl. the global check)`,
      target,
      runs: 15,
      medianMs: t.median,
      p95Ms: t.p95,
      note: `mean CPU ${cpuMs.toFixed(1)} ms per solve; ${eq.kind}, ${eq.method}${eq.kind === "pure" ? `, Nash gap ${eq.nashGap.toExponential(2)}, ${binding} budgets bind` : ""}`,
    });
  }
  return rows;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  for (const r of frontsRows(time)) {
    console.log(
      `${r.case}: median ${r.medianMs.toFixed(1)} ms, p95 ${r.p95Ms.toFixed(1)} ms (target ${r.target}); ${r.note ?? ""}`,
    );
  }
}
