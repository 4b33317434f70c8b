/**
 * How fast this machine is right now, as the time of one fixed piece of work. A virtual
 * machine's speed drifts with what its neighbours do (on the 2-core VM of docs/benchmarks.md
 * the same load run used 4.0 s of server CPU in one quarter of an hour and 5.2 s in the next),
 * so a load report gives this figure from before and after its run: two runs are comparable
 * only when it is close.
 */
import { summarize } from "./stats";

// Shaped like the work the servers do: JSON out and back, small objects, arithmetic.
const SAMPLE = {
  rounds: Array.from({ length: 12 }, (_, r) => ({
    round: r + 1,
    efforts: Array.from({ length: 8 }, (_, i) => 10 + ((r * 7 + i * 13) % 90)),
    shares: Array.from({ length: 8 }, (_, i) => (i + 1) / 36),
    note: `round ${r + 1} of the kiosk lease`,
  })),
};

function work(): number {
  let check = 0;
  for (let k = 0; k < 1200; k++) {
    const copy = JSON.parse(JSON.stringify(SAMPLE)) as typeof SAMPLE;
    for (const r of copy.rounds) {
      for (let i = 0; i < r.efforts.length; i++) check += Math.sqrt(r.efforts[i]! * r.shares[i]!);
    }
  }
  return check;
}

/** median milliseconds of the fixed work over `trials` runs, after one unmeasured run */
export function speedCheckMs(trials = 7): number {
  let sink = work();
  const ms: number[] = [];
  for (let t = 0; t < trials; t++) {
    const t0 = performance.now();
    sink += work();
    ms.push(performance.now() - t0);
  }
  if (!Number.isFinite(sink)) throw new Error("speed check: the work went wrong");
  return summarize(ms).p50;
}
