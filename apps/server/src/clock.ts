/**
 * Time and timers behind one small interface so tests can move time by hand instead of
 * sleeping through a round clock.
 */
export interface Clock {
  now(): number;
  /** `unref`: the timer alone does not keep the process running (a manual clock ignores it) */
  setTimer(fn: () => void, ms: number, opts?: { unref?: boolean }): TimerHandle;
  clearTimer(handle: TimerHandle): void;
}

export type TimerHandle = { readonly id: unknown };

/** setTimeout cannot wait longer than 2^31-1 ms; longer waits are re-armed in steps. */
const MAX_DELAY = 2_147_483_647;

export const systemClock: Clock = {
  now: () => Date.now(),
  setTimer(fn, ms, opts) {
    const handle: { id: ReturnType<typeof setTimeout> | null } = { id: null };
    const arm = (remaining: number) => {
      const step = Math.min(Math.max(0, remaining), MAX_DELAY);
      handle.id = setTimeout(() => {
        if (remaining > MAX_DELAY) arm(remaining - MAX_DELAY);
        else fn();
      }, step);
      if (opts?.unref) handle.id.unref();
    };
    arm(ms);
    return handle;
  },
  clearTimer(handle) {
    const h = handle as { id: ReturnType<typeof setTimeout> | null };
    if (h.id !== null) clearTimeout(h.id);
  },
};

/** A clock for tests: time stands still until `advance` is called, which fires due timers. */
export interface ManualClock extends Clock {
  advance(ms: number): void;
  pending(): number;
}

export function createManualClock(start = Date.UTC(2026, 0, 5, 9, 0, 0)): ManualClock {
  let now = start;
  let nextId = 0;
  const timers = new Map<number, { at: number; fn: () => void }>();
  return {
    now: () => now,
    setTimer(fn, ms) {
      const id = nextId++;
      timers.set(id, { at: now + Math.max(0, ms), fn });
      return { id };
    },
    clearTimer(handle) {
      timers.delete(handle.id as number);
    },
    advance(ms) {
      const target = now + ms;
      for (;;) {
        let dueId: number | null = null;
        let dueAt = Infinity;
        for (const [id, t] of timers) {
          if (t.at <= target && t.at < dueAt) {
            dueAt = t.at;
            dueId = id;
          }
        }
        if (dueId === null) break;
        const timer = timers.get(dueId);
        timers.delete(dueId);
        now = Math.max(now, dueAt);
        timer?.fn();
      }
      now = target;
    },
    pending: () => timers.size,
  };
}
