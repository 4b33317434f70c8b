import { describe, expect, it } from "vitest";
import { formatCapacity, largestMeeting, parseSizes } from "../src/capacity";
import type { CapacityRow } from "../src/capacity";

const row = (seats: number, revealP99: number, lost = 0): CapacityRow => ({
  sessions: seats / 8,
  seats,
  joinSeconds: 1,
  movesPerSecond: 100,
  ackP99: 10,
  revealP50: 5,
  revealP99,
  bareRevealP99: 10,
  serverCpuPercent: 50,
  cpuMsPerMove: 0.5,
  lost,
});

describe("capacity", () => {
  it("reads sizes and refuses anything but positive integers", () => {
    expect(parseSizes("50, 100,150")).toEqual([50, 100, 150]);
    for (const bad of ["", "0", "50,,100", "1.5", "-4", "ten"]) {
      expect(() => parseSizes(bad), bad).toThrow(/positive integers/);
    }
  });

  it("the largest size counts only runs under 100 ms that lost nothing", () => {
    expect(largestMeeting([row(400, 40), row(800, 99.9), row(1200, 100), row(1600, 300)])).toBe(
      800,
    );
    expect(largestMeeting([row(400, 40), row(800, 50, 1), row(1200, 60, Number.NaN)])).toBe(400);
    expect(largestMeeting([row(800, 150)])).toBeNull();
    expect(formatCapacity([row(800, 150)])).toContain("No size met");
    expect(formatCapacity([row(400, 20)])).toMatch(/400 seats\.$/);
    expect(formatCapacity([row(400, 20)])).toMatch(/\| seats \| join \(s\) \|/);
  });
});
