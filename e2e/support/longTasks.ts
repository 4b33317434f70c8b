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

/**
 * Waits inside the page, with one MutationObserver and no polling from the test, until an
 * element with this data-testid is in the document. Use it instead of `expect(...)` while long
 * tasks are being recorded: each miss of a polling `expect` makes Playwright take an aria
 * snapshot of the whole page on the page's main thread for its error message (150 ms on the
 * explorer, measured with a CPU profile), which the recording would count as the page's own.
 */
export async function waitForTestIdQuietly(
  page: Page,
  testId: string,
  timeoutMs = 60_000,
): Promise<void> {
  await page.evaluate(
    ([id, ms]) =>
      new Promise<void>((resolve, reject) => {
        type El = object | null;
        const g = globalThis as unknown as {
          document: { body: object; querySelector(s: string): El };
          MutationObserver: new (cb: () => void) => {
            observe(n: object, o: { childList: boolean; subtree: boolean }): void;
            disconnect(): void;
          };
        };
        const sel = `[data-testid="${id}"]`;
        if (g.document.querySelector(sel)) return resolve();
        const timer = setTimeout(() => {
          obs.disconnect();
          reject(new Error(`data-testid "${id}" did not appear within ${ms} ms`));
        }, ms as number);
        const obs = new g.MutationObserver(() => {
          if (!g.document.querySelector(sel)) return;
          clearTimeout(timer);
          obs.disconnect();
          resolve();
        });
        obs.observe(g.document.body, { childList: true, subtree: true });
      }),
    [testId, timeoutMs] as const,
  );
}
