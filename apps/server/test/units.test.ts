import { describe, expect, it } from "vitest";
import { createManualClock } from "../src/clock";
import { parseEnv } from "../src/env";
import { toCsv } from "../src/http/csv";
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
    const task = (name: string, ms: number) => async () => {
      running++;
      maxRunning = Math.max(maxRunning, running);
      log.push(`start ${name}`);
      await new Promise((r) => setTimeout(r, ms));
      log.push(`end ${name}`);
      running--;
      return name;
    };
    const results = await Promise.all([
      queue.run("a", task("1", 20)),
      queue.run("a", task("2", 1)),
      queue.run("a", task("3", 5)),
    ]);
    expect(results).toEqual(["1", "2", "3"]);
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
    expect(env.adminKey).toBeNull();
    expect(env.web).toBe(false);
    expect(env.limits).toEqual({
      ratePerSecond: 20,
      rateBurst: 40,
      maxMessageBytes: 65536,
      maxBodyBytes: 262144,
      progressPushMs: 200,
    });
    expect(env.databaseUrl).toMatch(/data\/pglite$/);
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

describe("toCsv(header, rows)", () => {
  it("toCsv quotes commas and quotes, defuses formulas and ends lines with CRLF (RFC 4180)", () => {
    const text = toCsv(
      ["a", "b", "c"],
      [
        ["x,y", 'say "hi"', 1.5],
        ["=SUM(A1)", null, true],
      ],
    );
    expect(text).toBe('a,b,c\r\n"x,y","say ""hi""",1.5\r\n\'=SUM(A1),,true\r\n');
  });
});
