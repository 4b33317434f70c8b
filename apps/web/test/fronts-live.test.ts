// The seat form of a session with fronts reads what was typed with the engine's own rule
// (checkAllocation, docs/protocol.md R46): blank boxes are zero, the remaining budget is the
// budget minus the total, and one cent over the budget is refused with the amounts in money.
import { describe, expect, it } from "vitest";
import { readAllocation } from "../src/lib/frontsLive";
import type { SeatFrontsTerms } from "../src/lib/frontsLive";

const terms: SeatFrontsTerms = {
  names: ["North", "South", "Harbour"],
  prizes: [100, 80, 60],
  cost: [1, 2, 1.5],
  value: [100, 80, 60],
  weight: [1, 1, 1],
  budget: 1000,
  sunk: false,
};

describe("readAllocation", () => {
  it("blank boxes count as zero; the remaining budget follows the total", () => {
    const e = readAllocation(["400", "", "250.5"], terms, "EUR");
    expect(e).toMatchObject({ typed: true, ok: true, spends: [400, 0, 250.5], total: 650.5 });
    expect(e.remaining).toBeCloseTo(349.5, 9);
  });

  it("exactly the budget is valid; one cent over is refused naming the budget", () => {
    expect(readAllocation(["500", "250", "250"], terms, "EUR").ok).toBe(true);
    const over = readAllocation(["500", "250", "250.01"], terms, "EUR");
    expect(over.ok).toBe(false);
    expect(over.remaining).toBeCloseTo(-0.01, 9);
    expect(over.problem).toMatch(
      /The total €1,000\.01 is over your budget of €1,000\.00 by €0\.01\./,
    );
  });

  it("a box that is not a number or is negative names its front", () => {
    const bad = readAllocation(["10", "-5", ""], terms, "EUR");
    expect(bad).toMatchObject({ ok: false, frontProblems: [null, "Zero or more", null] });
    expect(bad.problem).toMatch(/^South/);
    expect(readAllocation(["", "", ""], terms, null).typed).toBe(false);
  });
});
