/** The benchmarks' one timer: warm-up runs, then the median and 95th percentile of timed runs (ms). */
export interface Timed {
  median: number;
  p95: number;
}

export function time(fn: () => unknown, opts: { warmup: number; runs: number }): Timed {
  for (let k = 0; k < opts.warmup; k++) fn();
  const t: number[] = [];
  for (let k = 0; k < opts.runs; k++) {
    const t0 = performance.now();
    fn();
    t.push(performance.now() - t0);
  }
  t.sort((a, b) => a - b);
  const at = (q: number) => t[Math.min(t.length - 1, Math.floor(q * t.length))]!;
  return { median: at(0.5), p95: at(0.95) };
}
