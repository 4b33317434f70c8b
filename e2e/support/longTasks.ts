/**
 * Long tasks (> 50 ms) a page's main thread runs, through the browser's PerformanceObserver
 * ("longtask" entries). Figures for reports, not timed assertions: speed targets live in
 * benchmarks. e2e has no DOM typings, so the page-side code names what it uses.
 */
import { loadavg } from "node:os";
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

interface TraceEvent {
  name: string;
  ph: string;
  pid: number;
  tid: number;
  dur?: number;
  tdur?: number;
  args: { name?: string };
}

/** A main-thread task that took over 50 ms: wall time and the thread's own CPU time (ms). */
export interface TracedTask {
  wall: number;
  cpu: number;
}

/**
 * Runs `during` under a Chrome trace and returns the page's main-thread tasks over 50 ms with
 * their CPU time, and the largest CPU time of any task. On a loaded machine a task's wall time
 * includes waiting for a core; its CPU time is the work the page itself did.
 */
export async function traceMainThreadTasks(
  page: Page,
  during: () => Promise<void>,
): Promise<{ long: TracedTask[]; maxCpu: number }> {
  const cdp = await page.context().newCDPSession(page);
  const events: TraceEvent[] = [];
  cdp.on("Tracing.dataCollected", (d) => events.push(...(d.value as unknown as TraceEvent[])));
  await cdp.send("Tracing.start", {
    categories: "devtools.timeline,disabled-by-default-devtools.timeline",
    transferMode: "ReportEvents",
  });
  await during();
  const complete = new Promise((resolve) => cdp.once("Tracing.tracingComplete", resolve));
  await cdp.send("Tracing.end");
  await complete;
  await cdp.detach();
  const main = events.find((e) => e.name === "thread_name" && e.args.name === "CrRendererMain");
  const tasks = events.filter(
    (e) =>
      e.name === "RunTask" &&
      e.ph === "X" &&
      e.pid === main?.pid &&
      e.tid === main?.tid &&
      e.dur !== undefined &&
      e.tdur !== undefined,
  );
  const ms = (us: number | undefined) => Math.round((us ?? 0) / 100) / 10;
  return {
    long: tasks.filter((t) => t.dur! > 50_000).map((t) => ({ wall: ms(t.dur), cpu: ms(t.tdur) })),
    maxCpu: Math.max(0, ...tasks.map((t) => ms(t.tdur))),
  };
}

/**
 * Prints the page's long tasks (Long Tasks API) and the traced ones with their CPU time, with
 * the machine's load: a figure for the report, not a timed assertion (speed targets live in
 * benchmarks).
 */
export async function logLongTasks(
  page: Page,
  what: string,
  traced: { long: TracedTask[]; maxCpu: number },
): Promise<void> {
  const longTasks = await readLongTasks(page);
  console.log(
    `${what}: long tasks on the page (ms): ${JSON.stringify(longTasks)} at load ${loadavg()[0]!.toFixed(1)}; ` +
      `traced tasks over 50 ms (wall/CPU ms): ${JSON.stringify(traced.long.map((t) => `${t.wall}/${t.cpu}`))}, ` +
      `largest task CPU ${traced.maxCpu} ms`,
  );
}
