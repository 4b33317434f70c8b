import { describe, expect, it } from "vitest";
import {
  currencyPrefix,
  formatClock,
  formatEffort,
  formatMoney,
  formatNumber,
  formatPercent,
  formatPlain,
  formatSigned,
  stepDecimals,
} from "../src/lib/format";

describe("currencyPrefix", () => {
  it("currencyPrefix(code) maps common ISO codes to symbols and keeps other text", () => {
    expect(currencyPrefix("EUR")).toBe("\u20ac");
    expect(currencyPrefix("usd")).toBe("$");
    expect(currencyPrefix("$")).toBe("$");
    expect(currencyPrefix("SEK")).toBe("SEK\u00a0");
    expect(currencyPrefix(null)).toBe("");
    expect(currencyPrefix("  ")).toBe("");
  });
});

describe("formatMoney", () => {
  it("formatMoney(value, currency) groups thousands and drops cents on large amounts", () => {
    expect(formatMoney(123456.78, "EUR")).toBe("\u20ac123,457");
    expect(formatMoney(25, "$")).toBe("$25");
    expect(formatMoney(20.4082, "$")).toBe("$20.41");
    expect(formatMoney(2.5, "$")).toBe("$2.50");
    expect(formatMoney(100, null)).toBe("100");
  });
  it("formatMoney(negative) puts the sign before the symbol and never shows -0", () => {
    expect(formatMoney(-1500, "GBP")).toBe("-\u00a31,500");
    expect(formatMoney(-0.0001, "$")).toBe("$0");
    expect(formatMoney(-0.25, "$", 2)).toBe("-$0.25");
  });
  it("formatMoney(NaN) renders a dash", () => {
    expect(formatMoney(Number.NaN, "$")).toBe("\u2013");
    expect(formatMoney(Infinity)).toBe("\u2013");
  });
});

describe("formatNumber / formatPercent / formatSigned", () => {
  it("formatNumber(value) shows about four significant digits", () => {
    expect(formatNumber(16.6666)).toBe("16.67");
    expect(formatNumber(0.123456)).toBe("0.1235");
    expect(formatNumber(12345.6)).toBe("12,346");
    expect(formatNumber(2, 3)).toBe("2.000");
  });
  it("formatPlain(value) drops trailing zeros and keeps small decimals", () => {
    expect(formatPlain(1)).toBe("1");
    expect(formatPlain(1.25)).toBe("1.25");
    expect(formatPlain(0.00002)).toBe("0.00002");
    expect(formatPlain(1100.5, 0)).toBe("1,101");
  });
  it("formatPercent(fraction) multiplies by 100", () => {
    expect(formatPercent(0.4567)).toBe("45.7%");
    expect(formatPercent(1)).toBe("100.0%");
  });
  it("formatSigned(value) marks positive values with +", () => {
    expect(formatSigned(0.25)).toBe("+0.250");
    expect(formatSigned(-1.3, 2)).toBe("-1.30");
    expect(formatSigned(0, 1)).toBe("0.0");
  });
});

describe("effort steps and clock", () => {
  it("stepDecimals(step) counts the decimals of the step", () => {
    expect(stepDecimals(1)).toBe(0);
    expect(stepDecimals(0.25)).toBe(2);
    expect(stepDecimals(500)).toBe(0);
    expect(stepDecimals(0.1)).toBe(1);
  });
  it("formatEffort(value, currency, step) rounds to the step's precision", () => {
    expect(formatEffort(12.5, "$", 0.5)).toBe("$12.5");
    expect(formatEffort(30000, "EUR", 500)).toBe("\u20ac30,000");
  });
  it("formatClock(ms) rounds up to whole seconds and never goes negative", () => {
    expect(formatClock(61_001)).toBe("1:02");
    expect(formatClock(59_000)).toBe("0:59");
    expect(formatClock(-5)).toBe("0:00");
    expect(formatClock(3_725_000)).toBe("1:02:05");
  });
});
