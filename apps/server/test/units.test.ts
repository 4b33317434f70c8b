import { performance } from "node:perf_hooks";
import { describe, expect, it, vi } from "vitest";
import { createManualClock } from "../src/clock";
import { parseEnv } from "../src/env";
import { BUSY_FROM, BUSY_FULL, eventLoopGauge, progressWindowMs } from "../src/loadGauge";
import { createTokenBucket } from "../src/rateLimit";
import { createSerialQueue } from "../src/serialQueue";

describe("createTokenBucket(rate, burst)", () => {
  it("createTokenBucket(20, 40) allows a burst of 40 then refills at 20 per second", () => {
    const bucket = createTokenBucket(20, 40, 0);
    let allowed = 0;
    for (let i = 0; i < 100; i++) if (bucket.take(0)) allowed++;
    expect(allowed).toBe(40);
    expect(bucket.take(0)).toBe(false);
    // 500 ms at 20/s refills 10 tokens
    let later = 0;
    for (let i = 0; i < 100; i++) if (bucket.take(500)) later++;
    expect(later).toBe(10);
  });

  it("createTokenBucket never holds more than burst after a long idle time", () => {
    const bucket = createTokenBucket(20, 5, 0);
    let allowed = 0;
    for (let i = 0; i < 50; i++) if (bucket.take(3_600_000)) allowed++;
    expect(allowed).toBe(5);
  });
});

describe("createSerialQueue()", () => {
  it("run(key, task) runs tasks of one key in arrival order, one at a time", async () => {
    const queue = createSerialQueue();
    const log: string[] = [];
    let running = 0;
    let maxRunning = 0;
    // each task waits until the test opens its gate: no timers, the test decides the order
    const gates = new Map<string, () => void>();
    const opened = new Map<string, Promise<void>>(
      ["1", "2", "3"].map((name) => [name, new Promise<void>((r) => gates.set(name, r))]),
    );
    const task = (name: string) => async () => {
      running++;
      maxRunning = Math.max(maxRunning, running);
      log.push(`start ${name}`);
      await opened.get(name);
      log.push(`end ${name}`);
      running--;
      return name;
    };
    const nextTurn = () => new Promise<void>((r) => setImmediate(r)); // pending callbacks run
    const all = Promise.all([
      queue.run("a", task("1")),
      queue.run("a", task("2")),
      queue.run("a", task("3")),
    ]);
    await nextTurn();
    expect(log).toEqual(["start 1"]);
    // the later tasks may go, task 1 may not: a queue that let them start would end them first
    gates.get("3")!();
    gates.get("2")!();
    await nextTurn();
    expect(log).toEqual(["start 1"]);
    gates.get("1")!();
    expect(await all).toEqual(["1", "2", "3"]);
    expect(maxRunning).toBe(1);
    expect(log).toEqual(["start 1", "end 1", "start 2", "end 2", "start 3", "end 3"]);
  });

  it("run(key, task) keeps going after a task rejects", async () => {
    const queue = createSerialQueue();
    const failing = queue.run("a", async () => {
      throw new Error("boom");
    });
    const next = queue.run("a", async () => 7);
    await expect(failing).rejects.toThrow("boom");
    await expect(next).resolves.toBe(7);
    await queue.idle();
  });
});

describe("createManualClock()", () => {
  it("advance(ms) fires due timers in time order and not the later ones", () => {
    const clock = createManualClock(1000);
    const fired: string[] = [];
    clock.setTimer(() => fired.push("b"), 200);
    clock.setTimer(() => fired.push("a"), 100);
    const c = clock.setTimer(() => fired.push("c"), 150);
    clock.setTimer(() => fired.push("d"), 1000);
    clock.clearTimer(c);
    clock.advance(500);
    expect(fired).toEqual(["a", "b"]);
    expect(clock.now()).toBe(1500);
    expect(clock.pending()).toBe(1);
  });
});

describe("parseEnv(source)", () => {
  it("parseEnv({}) gives the documented defaults", () => {
    const env = parseEnv({ WEB: "off" });
    expect(env.port).toBe(3000);
    expect(env.host).toBe("0.0.0.0");
    expect(env.operatorKey).toBeNull();
    expect(env.retainDays).toBeNull();
    expect(env.web).toBe(false);
    expect(env.limits).toEqual({
      ratePerSecond: 20,
      rateBurst: 40,
      maxMessageBytes: 65536,
      maxBodyBytes: 262144,
      progressPushMs: 200,
      progressPushBusyMs: 1000,
      connectionsPerIp: 200,
      connectsPerIpPerMinute: 400,
      messagesPerIpPerSecond: 400,
      authFailuresPerIpPerMinute: 20,
      sessionsPerIpPerHour: 30,
      trustProxy: false,
    });
    expect(env.databaseUrl).toMatch(/data\/pglite$/);
  });

  it("parseEnv reads PROGRESS_PUSH_BUSY_MS and rejects one out of range, naming it", () => {
    expect(parseEnv({ PROGRESS_PUSH_BUSY_MS: "2500", WEB: "off" }).limits.progressPushBusyMs).toBe(
      2500,
    );
    expect(() => parseEnv({ PROGRESS_PUSH_BUSY_MS: "9000" })).toThrow(/PROGRESS_PUSH_BUSY_MS/);
    expect(() => parseEnv({ PROGRESS_PUSH_BUSY_MS: "-1" })).toThrow(/PROGRESS_PUSH_BUSY_MS/);
  });

  it("CONTEND_ADMIN_KEY (the old name) refuses with a line naming the new one", () => {
    expect(() => parseEnv({ CONTEND_ADMIN_KEY: "an-old-style-key" })).toThrow(
      /CONTEND_ADMIN_KEY: renamed CONTEND_OPERATOR_KEY/,
    );
    expect(parseEnv({ CONTEND_OPERATOR_KEY: "x".repeat(24), WEB: "off" }).operatorKey).toBe(
      "x".repeat(24),
    );
  });

  it("WORKERS=N refuses with a clear line without PostgreSQL, and is taken with it", () => {
    expect(parseEnv({ WORKERS: "1", WEB: "off" }).port).toBe(3000);
    expect(() => parseEnv({ WORKERS: "4" })).toThrow(
      /WORKERS=4 needs DATABASE_URL=postgres:\/\/\.\.\.: the embedded database serves one process only/,
    );
    expect(() => parseEnv({ WORKERS: "2", DATABASE_URL: "/tmp/contend-pglite" })).toThrow(
      /needs DATABASE_URL=postgres/,
    );
    expect(() =>
      parseEnv({ WORKERS: "2", DATABASE_URL: "postgres://contend@db.internal/contend" }),
    ).not.toThrow();
    expect(
      parseEnv({ WORKERS: "2", DATABASE_URL: "postgres://contend@db.internal/contend", WEB: "off" })
        .workers,
    ).toBe(2);
    expect(() => parseEnv({ WORKERS: "0" })).toThrow(/WORKERS/);
  });

  it("parseEnv rejects a non-numeric PORT naming the variable", () => {
    expect(() => parseEnv({ PORT: "eighty" })).toThrow(/PORT/);
  });

  it("parseEnv uses CONTEND_DATA_DIR when DATABASE_URL is unset and DATABASE_URL when set", () => {
    expect(parseEnv({ CONTEND_DATA_DIR: "/tmp/x", WEB: "off" }).databaseUrl).toBe("/tmp/x/pglite");
    expect(
      parseEnv({ DATABASE_URL: "postgres://u@h/db", CONTEND_DATA_DIR: "/tmp/x", WEB: "off" })
        .databaseUrl,
    ).toBe("postgres://u@h/db");
  });
});

describe("progressWindowMs(quiet, busy, reading)", () => {
  it("keeps the quiet window up to BUSY_FROM and the busy one from BUSY_FULL", () => {
    for (const r of [0, 0.3, BUSY_FROM, Number.NaN])
      expect(progressWindowMs(200, 1000, r)).toBe(200);
    for (const r of [BUSY_FULL, 0.95, 1]) expect(progressWindowMs(200, 1000, r)).toBe(1000);
  });

  it("moves linearly in between: halfway there is the mean of the two windows", () => {
    expect(progressWindowMs(200, 1000, (BUSY_FROM + BUSY_FULL) / 2)).toBe(600);
    let previous = 200;
    for (let r = BUSY_FROM; r <= BUSY_FULL; r += 0.01) {
      const w = progressWindowMs(200, 1000, r);
      expect(w).toBeGreaterThanOrEqual(previous);
      previous = w;
    }
  });

  it("never shortens the quiet window: a busy window below it is read as the quiet one", () => {
    for (const r of [0, 0.75, 1]) expect(progressWindowMs(500, 100, r)).toBe(500);
    for (const r of [0, 1]) expect(progressWindowMs(0, 0, r)).toBe(0);
  });
});

describe("eventLoopGauge(periodMs, times)", () => {
  it("reads the share of each period the loop spent working (active / (active + idle))", () => {
    vi.useFakeTimers();
    // cumulative counters as Node reports them; the test moves them, not the clock of the machine
    const counters = { active: 0, idle: 0 };
    const gauge = eventLoopGauge(100, () => ({ ...counters }));
    try {
      expect(gauge.busy()).toBe(0); // no full period yet
      counters.idle += 100; // an idle period: the loop waited the whole time
      vi.advanceTimersByTime(100);
      expect(gauge.busy()).toBe(0);
      expect(gauge.busy()).toBeLessThan(BUSY_FROM);
      counters.active += 80; // a busy period: 80 ms of work, 20 ms of waiting
      counters.idle += 20;
      vi.advanceTimersByTime(100);
      expect(gauge.busy()).toBeCloseTo(0.8, 12);
      counters.active += 100; // never waiting
      vi.advanceTimersByTime(100);
      expect(gauge.busy()).toBe(1);
      expect(gauge.busy()).toBeGreaterThanOrEqual(BUSY_FULL);
      vi.advanceTimersByTime(100); // nothing happened in the period: read as idle
      expect(gauge.busy()).toBe(0);
    } finally {
      gauge.stop();
      vi.useRealTimers();
    }
  });

  it("Node's own counters, sampled once, are cumulative milliseconds (what the gauge subtracts)", () => {
    const a = performance.eventLoopUtilization();
    const b = performance.eventLoopUtilization();
    expect(b.active + b.idle).toBeGreaterThanOrEqual(a.active + a.idle);
    expect(a.utilization).toBeGreaterThanOrEqual(0);
    expect(a.utilization).toBeLessThanOrEqual(1);
  });
});
