import { describe, expect, it } from "vitest";
import {
  formatCompact,
  currencyPrefix,
  formatClock,
  formatMoney,
  formatNumber,
  formatPercent,
  formatPlain,
  formatSigned,
} from "../src/lib/format";

describe("currencyPrefix", () => {
  it("currencyPrefix(code) gives Intl's symbol for ISO codes and keeps other text", () => {
    expect(currencyPrefix("EUR")).toBe("\u20ac");
    expect(currencyPrefix("usd")).toBe("$");
    expect(currencyPrefix("$")).toBe("$");
    expect(currencyPrefix("\u20ack")).toBe("\u20ack");
    expect(currencyPrefix("SEK")).toBe("SEK\u00a0");
    expect(currencyPrefix(null)).toBe("");
    expect(currencyPrefix("  ")).toBe("");
  });
});

// The disagreeing formats of the workshop run: "Use 260.0" beside "€k260", ticks "65.00 / 130.0",
// "€k1,243" beside "€k394.46", "0.51758794" in a table. One rule now: about four significant
// digits, whole numbers in full, no trailing zeros, money at most to the cent.
describe("one number format", () => {
  it("formatMoney(value, currency) groups thousands, four significant digits, at most cents", () => {
    expect(formatMoney(123456.78, "EUR")).toBe("\u20ac123,457");
    expect(formatMoney(260, "\u20ack")).toBe("\u20ack260");
    expect(formatMoney(1243, "\u20ack")).toBe("\u20ack1,243");
    expect(formatMoney(394.46, "\u20ack")).toBe("\u20ack394.5");
    expect(formatMoney(180, "\u20ack")).toBe("\u20ack180");
    expect(formatMoney(25, "$")).toBe("$25");
    expect(formatMoney(20.4082, "$")).toBe("$20.41");
    expect(formatMoney(2.5, "$")).toBe("$2.5");
    expect(formatMoney(0.001234, "$")).toBe("$0");
    expect(formatMoney(100, null)).toBe("100");
    expect(formatMoney(1234.5, "SEK")).toBe("SEK\u00a01,235");
  });
  it("formatMoney(negative) puts the sign before the symbol and never shows -0", () => {
    expect(formatMoney(-1500, "GBP")).toBe("-\u00a31,500");
    expect(formatMoney(-0.0001, "$")).toBe("$0");
    expect(formatMoney(-0.0001, "EUR")).toBe("\u20ac0");
    expect(formatMoney(-0.25, "$", 2)).toBe("-$0.25");
  });
  it("formatMoney(NaN) renders a dash", () => {
    expect(formatMoney(Number.NaN, "$")).toBe("\u2013");
    expect(formatMoney(Infinity)).toBe("\u2013");
  });
  it("formatNumber(value) shows about four significant digits without trailing zeros", () => {
    expect(formatNumber(16.6666)).toBe("16.67");
    expect(formatNumber(0.51758794)).toBe("0.5176");
    expect(formatNumber(12345.6)).toBe("12,346");
    expect(formatNumber(65)).toBe("65");
    expect(formatNumber(130)).toBe("130");
    expect(formatNumber(260)).toBe("260");
    expect(formatNumber(-0.00001)).toBe("-0.00001");
    expect(formatNumber(2, 3)).toBe("2.000");
  });
  it("formatPlain(value) drops trailing zeros and keeps small decimals", () => {
    expect(formatPlain(1)).toBe("1");
    expect(formatPlain(1.25)).toBe("1.25");
    expect(formatPlain(0.00002)).toBe("0.00002");
    expect(formatPlain(1100.5, 0)).toBe("1,101");
  });
  it("formatPercent(fraction) shows three significant digits", () => {
    expect(formatPercent(0.4567)).toBe("45.7%");
    expect(formatPercent(1)).toBe("100%");
    expect(formatPercent(0.051758794)).toBe("5.18%");
  });
  it("formatSigned(value) marks positive values with +", () => {
    expect(formatSigned(0.25)).toBe("+0.25");
    expect(formatSigned(-1.3, 2)).toBe("-1.30");
    expect(formatSigned(0, 1)).toBe("0.0");
  });
});

describe("compact axis numbers", () => {
  it("formatCompact abbreviates thousands and millions with at most four significant digits (en-US Intl compact notation)", () => {
    expect(formatCompact(45000)).toBe("45K");
    expect(formatCompact(51750)).toBe("51.75K");
    expect(formatCompact(1234567)).toBe("1.235M");
    expect(formatCompact(12.5)).toBe("12.5");
    expect(formatCompact(Number.NaN)).toBe(formatNumber(Number.NaN));
  });
});

describe("clock", () => {
  it("formatClock(ms) rounds up to whole seconds and never goes negative", () => {
    expect(formatClock(61_001)).toBe("1:02");
    expect(formatClock(59_000)).toBe("0:59");
    expect(formatClock(-5)).toBe("0:00");
    expect(formatClock(3_725_000)).toBe("1:02:05");
  });
});
