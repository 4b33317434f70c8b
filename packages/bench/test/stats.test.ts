import { describe, expect, it } from "vitest";
import { percentile, ratio, summarize } from "../src/stats";
import { markdownTable } from "../src/table";
import { flag, hasFlag, intFlag } from "../src/flags";
import { missingMoves } from "../src/api";
import { cpuSeconds, parseStat } from "../src/proc";

describe("percentile", () => {
  // Nearest-rank worked example: for 15, 20, 35, 40, 50 the 30th percentile is 20, the 40th is 20,
  // the 50th is 35 and the 100th is 50 (the usual textbook example of the nearest-rank method).
  const data = [15, 20, 35, 40, 50];
  it("percentile(sorted, q) follows the nearest-rank worked example", () => {
    expect(percentile(data, 0.3)).toBe(20);
    expect(percentile(data, 0.4)).toBe(20);
    expect(percentile(data, 0.5)).toBe(35);
    expect(percentile(data, 1)).toBe(50);
  });
  it("percentile(sorted, 0) is the minimum and an empty array gives NaN", () => {
    expect(percentile(data, 0)).toBe(15);
    expect(percentile([], 0.5)).toBeNaN();
  });
  it("percentile(sorted, q) refuses q outside [0, 1]", () => {
    expect(() => percentile(data, 1.5)).toThrow(RangeError);
    expect(() => percentile(data, Number.NaN)).toThrow(RangeError);
  });
  it("percentile(1..1000, 0.99) is 990, the value with 99% of the data at or below it", () => {
    const big = Array.from({ length: 1000 }, (_, i) => i + 1);
    expect(percentile(big, 0.99)).toBe(990);
    expect(percentile(big, 0.5)).toBe(500);
  });
});

describe("summarize", () => {
  it("summarize(unsorted) sorts first and reports count, p50, p99, max and mean", () => {
    const s = summarize([5, 1, 4, 2, 3]);
    expect(s).toEqual({ count: 5, p50: 3, p99: 5, max: 5, mean: 3 });
  });
  it("summarize([]) gives NaN figures with count 0", () => {
    const s = summarize([]);
    expect(s.count).toBe(0);
    expect(s.p99).toBeNaN();
    expect(s.mean).toBeNaN();
  });
});

describe("ratio", () => {
  it("ratio(a, b) divides, and is NaN without a positive baseline", () => {
    expect(ratio(3, 2)).toBe(1.5);
    expect(ratio(3, 0)).toBeNaN();
    expect(ratio(Number.NaN, 2)).toBeNaN();
  });
});

describe("markdownTable", () => {
  it("markdownTable(header, rows) pads columns and prints n/a for NaN and - for null", () => {
    const t = markdownTable(
      ["a", "bb"],
      [
        [1.25, Number.NaN],
        [null, true],
      ],
    );
    expect(t.split("\n")).toEqual([
      "| a   | bb  |",
      "| --- | --- |",
      "| 1.3 | n/a |",
      "| -   | yes |",
    ]);
  });
});

describe("parseStat", () => {
  it("parseStat(line) reads utime and stime (fields 14 and 15 of proc(5)) past a name with spaces", () => {
    // fields: pid (comm) state ppid pgrp session tty tpgid flags minflt cminflt majflt cmajflt utime stime ...
    const line = "4242 (node (x) y) S 1 2 3 4 5 6 7 8 9 10 1234 567 0 0 20 0 11 0 100 2000 300";
    expect(parseStat(line)).toEqual({ utimeTicks: 1234, stimeTicks: 567 });
  });
  it("cpuSeconds(pid) of this process is a non-negative number", () => {
    const s = cpuSeconds(process.pid);
    expect(s).not.toBeNull();
    expect(s!).toBeGreaterThanOrEqual(0);
  });
});

describe("missingMoves", () => {
  it("missingMoves(acked, logs) lists acked moves whose move-sealed event is absent or differs", () => {
    const a = { sessionId: "s", round: 1, seatIndex: 0, clientMoveId: "m1", effort: 10 };
    const b = { sessionId: "s", round: 1, seatIndex: 1, clientMoveId: "m2", effort: 12 };
    const c = { sessionId: "s", round: 2, seatIndex: 0, clientMoveId: "m3", effort: 5 };
    const logs = new Map([
      [
        "s",
        [
          { seq: 3, type: "move-sealed", round: 1, seatIndex: 0, clientMoveId: "m1", effort: 10 },
          { seq: 4, type: "move-sealed", round: 1, seatIndex: 1, clientMoveId: "m2", effort: 13 },
        ],
      ],
    ]);
    expect(missingMoves([a, b, c], logs)).toEqual([b, c]);
  });
});

describe("flags", () => {
  it("flag(argv, name) reads --name value, --name=value and bare switches", () => {
    const argv = ["--sessions", "20", "--seats=8", "--full", "--json"];
    expect(intFlag(argv, "sessions", 1)).toBe(20);
    expect(intFlag(argv, "seats", 1)).toBe(8);
    expect(intFlag(argv, "rounds", 3)).toBe(3);
    expect(hasFlag(argv, "full")).toBe(true);
    expect(hasFlag(argv, "bare")).toBe(false);
    expect(flag(argv, "json")).toBe("");
  });
  it("intFlag(argv, name) refuses a non-integer", () => {
    expect(() => intFlag(["--sessions", "2.5"], "sessions", 1)).toThrow(/integer/);
  });
});
