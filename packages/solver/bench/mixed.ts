/**
 * Benchmarks of the answers without a symmetric pure equilibrium: identical rivals above the
 * existence bound (one representative per number of active rivals), two-rival mixed
 * equilibria (double oracle with its certified gap) and approximate ones with three to ten
 * rivals (fictitious play with its certified gap).
 */
import { loadavg } from "node:os";
import { normalize, solve, type Scenario } from "../src/index";
import { time, type Timed } from "./timer";

export interface MixedBenchRow {
  case: string;
  target: string;
  runs: number;
  medianMs: number;
  p95Ms: number;
  note?: string;
}

const identical = (n: number, r: number): Scenario => ({
  title: `${n} identical rivals`,
  prize: 1000,
  csf: { kind: "ratio", decisiveness: r },
  rivals: Array.from({ length: n }, (_, i) => ({ name: `R${i}`, cost: 1 })),
});

const pair = (r: number, costs: [number, number], kind: "ratio" | "logit" = "ratio"): Scenario => ({
  title: "two rivals",
  prize: 100,
  csf: kind === "ratio" ? { kind, decisiveness: r } : { kind, scale: r },
  rivals: [
    { name: "A", cost: costs[0] },
    { name: "B", cost: costs[1] },
  ],
});

export function mixedBench(
  time: (fn: () => unknown, opts: { warmup: number; runs: number }) => Timed,
): MixedBenchRow[] {
  const rows: MixedBenchRow[] = [];
  for (const r of [2, 1.5, 1.3]) {
    const c = normalize(identical(10_000, r));
    const t = time(() => solve(c), { warmup: 2, runs: 10 });
    const res = solve(c);
    const all = [res.equilibrium, ...res.alternatives];
    rows.push({
      case: `solve() 10,000 identical rivals, r = ${r}`,
      target: "< 50 ms",
      runs: 10,
      medianMs: t.median,
      p95Ms: t.p95,
      note: `active sets of size ${all.map((e) => e.active.filter(Boolean).length).join(", ")}; gap ${Math.max(...all.map((e) => e.nashGap)).toExponential(2)}`,
    });
  }
  const cases: [string, Scenario][] = [
    ["r = 1.5, costs 5 and 2 (semi-mixed)", pair(1.5, [5, 2])],
    ["r = 3, identical (mass points at 0)", pair(3, [1, 1])],
    ["r = 3, costs 1 and 5/3 (all-pay outcome)", pair(3, [1, 5 / 3])],
    ["logit k = 0.2, identical", pair(0.2, [1, 1], "logit")],
  ];
  for (const [name, s] of cases) {
    const c = normalize(s);
    const t = time(() => solve(c), { warmup: 2, runs: 10 });
    const eq = solve(c).equilibrium;
    rows.push({
      case: `solve() two rivals, mixed, ${name}`,
      target: "< 200 ms",
      runs: 10,
      medianMs: t.median,
      p95Ms: t.p95,
      note: `${eq.kind}, certified gap ${(eq.nashGap / c.prize).toExponential(2)} of the prize`,
    });
  }
  const many: [string, number[], number][] = [
    ["three rivals, r = 3, costs 1, 1.2, 1.5", [1, 1.2, 1.5], 3],
    ["four rivals, r = 2.5, costs 1, 1.1, 1.3, 1.6", [1, 1.1, 1.3, 1.6], 2.5],
    ["six identical rivals, r = 3", [1, 1, 1, 1, 1, 1], 3],
    ["ten rivals, r = 3, costs 1 to 1.9", Array.from({ length: 10 }, (_, i) => 1 + i / 10), 3],
  ];
  for (const [name, costs, r] of many) {
    const c = normalize({
      title: name,
      prize: 100,
      csf: { kind: "ratio", decisiveness: r },
      rivals: costs.map((cost, i) => ({ name: `R${i}`, cost })),
    });
    const t = time(() => solve(c), { warmup: 1, runs: 3 });
    const eq = solve(c).equilibrium;
    rows.push({
      case: `solve() ${name}, mixed (fictitious play, 1000 rounds or 10 s)`,
      target: "< 10 s (the stated budget)",
      runs: 3,
      medianMs: t.median,
      p95Ms: t.p95,
      note: `${eq.kind}, certified gap ${(eq.nashGap / c.prize).toExponential(2)} of the prize`,
    });
  }
  return rows;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const load = () =>
    loadavg()
      .map((x) => x.toFixed(1))
      .join(" ");
  console.log(`load average ${load()} at ${new Date().toISOString()}`);
  for (const r of mixedBench(time)) {
    console.log(
      `${r.case}: median ${r.medianMs.toFixed(1)} ms, p95 ${r.p95Ms.toFixed(1)} ms (target ${r.target}); ${r.note ?? ""}`,
    );
  }
  console.log(`load average ${load()} at ${new Date().toISOString()}`);
}
