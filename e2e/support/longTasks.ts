/**
 * Long tasks (> 50 ms) a page's main thread runs, through the browser's PerformanceObserver
 * ("longtask" entries). Figures for reports, not timed assertions: speed targets live in
 * benchmarks. e2e has no DOM typings, so the page-side code names what it uses.
 */
import type { Page } from "@playwright/test";

type Global = { __long: number[] };

/** Starts recording before the page's own scripts run (call before goto). */
export async function watchLongTasks(page: Page): Promise<void> {
  await page.addInitScript(() => {
    const g = globalThis as unknown as Global & {
      PerformanceObserver: new (cb: (l: { getEntries(): { duration: number }[] }) => void) => {
        observe(o: { type: string; buffered: boolean }): void;
      };
    };
    g.__long = [];
    new g.PerformanceObserver((l) => {
      for (const e of l.getEntries()) g.__long.push(e.duration);
    }).observe({ type: "longtask", buffered: true });
  });
}

/** Forgets the long tasks recorded so far. */
export async function resetLongTasks(page: Page): Promise<void> {
  await page.evaluate(() => ((globalThis as unknown as Global).__long = []));
}

/** The durations (ms, rounded) recorded since the last reset. */
export async function readLongTasks(page: Page): Promise<number[]> {
  const d = await page.evaluate(() => (globalThis as unknown as Global).__long);
  return d.map(Math.round);
}
