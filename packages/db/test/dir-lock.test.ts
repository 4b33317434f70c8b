// The data-directory lock: who counts as its owner. Pure cases inject the clock-free inputs
// (the lock's age, the pid table); the file cases run against a real temp directory.
import { existsSync, readFileSync, utimesSync, writeFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { LOCK_WRITE_GRACE_MS, lockDataDir, lockState, processStart } from "../src/dirLock";
import { dataDirs } from "./dataDirs";

describe("lockState", () => {
  const running = (pids: number[]) => (pid: number) => pids.includes(pid);
  const starts = (table: Record<number, string>) => (pid: number) => table[pid] ?? null;

  it("a lock file without an owner line yet is held while fresh, abandoned after the grace", () => {
    expect(lockState("", 0, starts({}), running([])).held).toBe(true);
    expect(lockState("", LOCK_WRITE_GRACE_MS - 1, starts({}), running([])).held).toBe(true);
    expect(lockState("", LOCK_WRITE_GRACE_MS, starts({}), running([])).held).toBe(false);
  });

  it("an owner that is not running is stale", () => {
    expect(lockState("42 900\n", 0, starts({}), running([])).held).toBe(false);
  });

  it("a running pid that started at another time is another process: stale (pid reused)", () => {
    // the owner took the lock as pid 1 started at tick 900; pid 1 is now a process started at 50
    expect(lockState("1 900\n", 0, starts({ 1: "50" }), running([1])).held).toBe(false);
  });

  it("the same pid with the same start time holds the lock", () => {
    expect(lockState("1 900\n", 0, starts({ 1: "900" }), running([1]))).toEqual({
      held: true,
      owner: { pid: 1, start: "900" },
    });
  });

  it("without a start time to compare (older lock format, or no /proc) a running pid holds it", () => {
    expect(lockState("7", 0, starts({ 7: "5" }), running([7])).held).toBe(true);
    expect(lockState("7 -\n", 0, starts({}), running([7])).held).toBe(true);
    expect(lockState("7 900\n", 0, starts({}), running([7])).held).toBe(true);
  });
});

describe("lockDataDir", () => {
  const dataDir = dataDirs("pglite");

  it("writes this process's pid and start time, and release removes it", () => {
    const dir = dataDir();
    const release = lockDataDir(dir);
    expect(readFileSync(`${dir}.lock`, "utf8")).toBe(
      `${process.pid} ${processStart(process.pid) ?? "-"}\n`,
    );
    release();
    expect(existsSync(`${dir}.lock`)).toBe(false);
  });

  it("a lock file that exists without a PID yet is not taken over", () => {
    const dir = dataDir();
    writeFileSync(`${dir}.lock`, ""); // another process between creating and writing it
    expect(() => lockDataDir(dir)).toThrow(/still writing its lock/);
    expect(existsSync(`${dir}.lock`)).toBe(true);
  });

  it("an empty lock file older than the grace period is taken over", () => {
    const dir = dataDir();
    writeFileSync(`${dir}.lock`, "");
    const old = new Date(Date.now() - 2 * LOCK_WRITE_GRACE_MS);
    utimesSync(`${dir}.lock`, old, old);
    const release = lockDataDir(dir);
    expect(readFileSync(`${dir}.lock`, "utf8")).toMatch(new RegExp(`^${process.pid} `));
    release();
  });

  it.runIf(processStart(process.pid) !== null)(
    "a dead owner whose pid now belongs to a running process does not block start-up",
    () => {
      const dir = dataDir();
      // this very pid, but a start time that is not ours: the owner was an earlier process
      // that had our pid (as pid 1 is again after a container restart)
      const mine = processStart(process.pid)!;
      const earlier = String(BigInt(mine) - 1n);
      writeFileSync(`${dir}.lock`, `${process.pid} ${earlier}\n`);
      const release = lockDataDir(dir);
      expect(readFileSync(`${dir}.lock`, "utf8")).toBe(`${process.pid} ${mine}\n`);
      release();
    },
  );

  it("a lock held by this process is refused a second time, naming this process", () => {
    const dir = dataDir();
    const release = lockDataDir(dir);
    try {
      expect(() => lockDataDir(dir)).toThrow(/in use by process \d+ \(this process/);
    } finally {
      release();
    }
  });

  it("release leaves alone a lock that another process has taken over since", () => {
    const dir = dataDir();
    const release = lockDataDir(dir);
    writeFileSync(`${dir}.lock`, "999999 1\n");
    release();
    expect(readFileSync(`${dir}.lock`, "utf8")).toBe("999999 1\n");
  });
});
