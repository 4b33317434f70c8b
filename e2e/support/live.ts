/**
 * Steps of a live session as a participant performs them on the pages (facilitator console,
 * seat view, big screen), plus the privacy checks on what each page shows.
 */
import type { Browser, BrowserContext, Locator, Page } from "@playwright/test";
import { expect } from "@playwright/test";
import { mentions } from "./frames";

/**
 * Path, query and fragment (where keys travel) of an absolute or relative link, so pages open
 * on the test server's origin.
 */
export function pathOf(link: string): string {
  const u = new URL(link, "http://placeholder");
  return `${u.pathname}${u.search}${u.hash}`;
}

export const PHONE = { width: 390, height: 844 } as const;

export async function phoneContext(browser: Browser, baseURL: string): Promise<BrowserContext> {
  return browser.newContext({
    baseURL,
    viewport: PHONE,
    isMobile: true,
    hasTouch: true,
    deviceScaleFactor: 2,
  });
}

/** Reads the value of a read-only link field of the "session created" panel. */
export async function linkValue(field: Locator): Promise<string> {
  await expect(field).toBeVisible();
  return pathOf(await field.inputValue());
}

/**
 * Types a spend (money) on a seat page, confirms it and waits until the page says it is sealed.
 * The last seal of a round resolves it at once, so then only the confirmation closing is awaited.
 */
export async function sealSpend(seat: Page, spend: number, resolvesRound = false): Promise<void> {
  const input = seat.getByTestId("spend-input");
  await expect(input).toBeEnabled();
  await input.fill(String(spend));
  await seat.getByTestId("seal-button").click();
  await expect(seat.getByTestId("seal-confirm")).toBeVisible();
  await seat.getByTestId("seal-confirm-button").click();
  await expect(seat.getByTestId("seal-confirm")).toBeHidden();
  if (resolvesRound) return;
  await expect(seat.getByTestId("seat-sealed-amount")).toHaveText(
    new RegExp(`${String(spend).replace(".", "\\.")}$`),
  );
}

/** The visible text of a page, for "does this page show that number" checks. */
export async function pageText(page: Page): Promise<string> {
  return page.locator("body").innerText();
}

/**
 * Asserts a page holds none of the numbers (as whole number tokens, e.g. 7.43 not in 17.432):
 * neither in its visible text nor anywhere in its DOM (hidden elements, attributes, inline data).
 */
export async function expectNotShown(page: Page, values: number[], who: string): Promise<void> {
  const text = await pageText(page);
  const html = await page.content();
  for (const v of values) {
    expect(mentions(text, v), `${who} shows ${v}`).toBe(false);
    expect(mentions(html, v), `${who} has ${v} in its DOM`).toBe(false);
  }
}

/** Asserts a page shows every number (the positive control of expectNotShown). */
export async function expectShownAll(page: Page, values: number[], who: string): Promise<void> {
  const text = await pageText(page);
  const html = await page.content();
  for (const v of values) {
    expect(mentions(text, v), `${who} shows ${v}`).toBe(true);
    expect(mentions(html, v), `${who} has ${v} in its DOM`).toBe(true);
  }
}
