/**
 * Reading numbers off the screen and comparing them with a reference at the precision shown:
 * "$4.08" equals 4.0816... because |4.08 - 4.0816| <= half a unit in the last shown digit.
 */
import { expect, type Locator } from "@playwright/test";

export interface Shown {
  value: number;
  /** digits after the decimal point as displayed */
  decimals: number;
  text: string;
}

/** Parses the first number in a text such as "€1,234.5", "-$0.25", "45.7%" or "−3.1". */
export function parseShown(text: string): Shown {
  const normalised = text.replace(/\u2212/g, "-").replace(/\u00a0/g, " ");
  const m = /(-?)\s*[^\d\s.-]*\s*(\d[\d,]*(?:\.(\d+))?)/.exec(normalised);
  if (!m) throw new Error(`no number in ${JSON.stringify(text)}`);
  const digits = m[2]!.replace(/,/g, "");
  const value = Number(digits) * (m[1] === "-" ? -1 : 1);
  return { value, decimals: m[3]?.length ?? 0, text };
}

/** Asserts a displayed text shows `expected` correctly rounded (scale: 100 for percentages). */
export function expectShownEquals(text: string, expected: number, label: string, scale = 1): void {
  const shown = parseShown(text);
  const halfUnit = 0.5 * 10 ** -shown.decimals;
  // 1e-9 relative slack absorbs binary floating point at the rounding edge.
  const slack = halfUnit + 1e-9 * Math.max(1, Math.abs(expected * scale));
  expect(
    Math.abs(shown.value - expected * scale),
    `${label}: shown ${JSON.stringify(text)} vs reference ${expected * scale}`,
  ).toBeLessThanOrEqual(slack);
}

/** True when a displayed text shows `expected` correctly rounded. */
export function showsValue(text: string, expected: number, scale = 1): boolean {
  try {
    const shown = parseShown(text);
    const slack = 0.5 * 10 ** -shown.decimals + 1e-9 * Math.max(1, Math.abs(expected * scale));
    return Math.abs(shown.value - expected * scale) <= slack;
  } catch {
    return false;
  }
}

/**
 * Waits until the element shows `expected` at its displayed precision (pages recompute after
 * typing, so the first text read may be the previous value), then asserts it with a clear message.
 */
export async function expectShown(
  locator: Locator,
  expected: number,
  label: string,
  scale = 1,
): Promise<void> {
  await expect
    .poll(async () => showsValue((await locator.textContent()) ?? "", expected, scale), {
      message: `${label}: waiting for ${expected * scale}`,
    })
    .toBe(true)
    .catch(() => undefined);
  expectShownEquals((await locator.textContent()) ?? "", expected, label, scale);
}
