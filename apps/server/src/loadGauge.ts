/**
 * How busy this process's event loop has been lately, so that cosmetic work can give way to
 * what people wait for. The only user is the progress window (sockets.ts): when the loop is
 * near full, other seats' "has sealed" flags are merged over a longer window, so acks and
 * round results do not queue behind frames that only move a progress display.
 */
import { performance } from "node:perf_hooks";
import type { EventLoopUtilization } from "node:perf_hooks";

export interface LoadGauge {
  /** event-loop utilisation (0 idle .. 1 never waiting) over the last full sample period */
  busy(): number;
  stop(): void;
}

/** For tests and tools that want a fixed reading. */
export function fixedGauge(value: number): LoadGauge {
  return { busy: () => value, stop: () => undefined };
}

/** Cumulative milliseconds the loop spent working and waiting since the process started. */
export type LoopTimes = () => Pick<EventLoopUtilization, "active" | "idle">;

/**
 * Node's event-loop utilisation (time not spent waiting for I/O over wall time), sampled every
 * `periodMs`; a reading is at most two periods old. `times` is Node's own counter unless a test
 * hands in another.
 */
export function eventLoopGauge(
  periodMs = 250,
  times: LoopTimes = () => performance.eventLoopUtilization(),
): LoadGauge {
  let last = times();
  let value = 0;
  const timer = setInterval(() => {
    const now = times();
    const active = now.active - last.active;
    const total = active + (now.idle - last.idle);
    value = total > 0 ? active / total : 0;
    last = now;
  }, periodMs);
  timer.unref();
  return { busy: () => value, stop: () => clearInterval(timer) };
}

/** Below this utilisation the quiet window applies. */
export const BUSY_FROM = 0.6;
/** From this utilisation on the busy window applies. */
export const BUSY_FULL = 0.9;

/**
 * The progress window for a reading: `quietMs` up to BUSY_FROM, `busyMs` from BUSY_FULL on,
 * linear in between (so the window does not jump back and forth around one threshold). A busy
 * window shorter than the quiet one is read as the quiet one.
 */
export function progressWindowMs(quietMs: number, busyMs: number, busy: number): number {
  const high = Math.max(quietMs, busyMs);
  if (!(busy > BUSY_FROM)) return quietMs;
  if (busy >= BUSY_FULL) return high;
  return Math.round(quietMs + ((high - quietMs) * (busy - BUSY_FROM)) / (BUSY_FULL - BUSY_FROM));
}
