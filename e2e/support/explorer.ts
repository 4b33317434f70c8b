/**
 * The explorer scenario the uncertainty journeys start from: two rivals in a ratio contest
 * (r = 1, prize 100), Rival A at cost 1 and Rival B at cost 2, and Rival B's cost as a range;
 * and a long Monte Carlo run that is started and cancelled.
 */
import type { Locator, Page } from "@playwright/test";
import { expect } from "./fixtures";

/** Opens the explorer and types every number the uncertainty checks depend on. */
export async function openTwoRivalExplorer(page: Page): Promise<void> {
  await page.goto("/explore");
  await page.getByRole("textbox", { name: /^Prize/ }).fill("100");
  await page.getByLabel("Decisiveness r").fill("1");
  await page.getByLabel("Rival 1 name").fill("Rival A");
  await page.getByLabel("Rival 2 name").fill("Rival B");
  await page.getByLabel("Rival 1 cost").fill("1");
  await page.getByLabel("Rival 2 cost").fill("2");
}

/** Types the low and high end of Rival B's cost range (its range toggle already on). */
export async function fillRivalBCostRange(page: Page, low: string, high: string): Promise<void> {
  await page.getByLabel("Low of Cost per unit of effort, Rival B").fill(low);
  await page.getByLabel("High of Cost per unit of effort, Rival B").fill(high);
}

/**
 * Starts a long run of `draws` in a panel whose controls share a test-id prefix (`<prefix>-draws`,
 * `-run`, `-progress`, `-cancel`, `-cancelled`), sees its progress, cancels it and sees it
 * cancelled.
 */
export async function runAndCancel(panel: Locator, prefix: string, draws: string): Promise<void> {
  await panel.getByTestId(`${prefix}-draws`).fill(draws);
  await panel.getByTestId(`${prefix}-run`).click();
  await expect(panel.getByTestId(`${prefix}-progress`)).toBeVisible();
  await panel.getByTestId(`${prefix}-cancel`).click();
  await expect(panel.getByTestId(`${prefix}-cancelled`)).toBeVisible();
}
