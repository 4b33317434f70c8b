/**
 * Mixed equilibrium in the explorer: two rivals with costs 5 and 2, prize 100, r = 1.5 have no
 * pure equilibrium; the stronger rival spends one amount and the weaker one randomises between
 * nothing and one spend (the semi-mixed equilibrium between the pure region and r = 2: Wang
 * 2010; Sahm 2022). The page must show the expected values and each rival's distribution.
 */
import path from "node:path";
import type { Page } from "@playwright/test";
import { expect, test } from "../support/fixtures";
import { RESULTS_DIR } from "../support/server";

/** The equilibrium card alone, beside the full-page screens, to look at the chart closely. */
async function saveCard(page: Page, name: string): Promise<void> {
  const card = page.locator("section[aria-labelledby=eq-title]");
  await card.screenshot({
    path: path.join(RESULTS_DIR, "screens", `${name}.png`),
  });
}

test("explorer(v=100, costs 5 and 2, r=1.5) shows a mixed equilibrium with expected values and a distribution per rival", async ({
  page,
  saveScreen,
}) => {
  await page.setViewportSize({ width: 1366, height: 768 });
  await page.goto("/explore");
  await expect(page.getByRole("heading", { name: "Equilibrium explorer" })).toBeVisible();
  await page.getByRole("textbox", { name: /^Prize/ }).fill("100");
  await page.getByLabel("Rival 1 cost").fill("5");
  await page.getByLabel("Rival 2 cost").fill("2");
  await page.getByLabel("Decisiveness r").fill("1.5");
  await expect(page.getByTestId("eq-kind")).toContainText("Mixed-strategy equilibrium");
  await expect(page.getByTestId("mixed-chart")).toBeVisible();
  // the weaker rival (index 0) spends nothing with some probability: named in its row
  await expect(page.getByTestId("mixed-chart-0")).toHaveAttribute("aria-label", /\(\d+(\.\d+)?%\)/);
  await expect(page.getByTestId("eq-effort-0")).not.toHaveText("\u2013");
  await page.getByTestId("mixed-chart").scrollIntoViewIfNeeded();
  await saveScreen(page, "explorer-mixed-laptop");
  await saveCard(page, "explorer-mixed-card-laptop");
  await page.setViewportSize({ width: 1920, height: 1080 });
  await saveScreen(page, "explorer-mixed-projector");
  await saveCard(page, "explorer-mixed-card-projector");
  await page.setViewportSize({ width: 390, height: 844 });
  await page.getByTestId("mixed-chart").scrollIntoViewIfNeeded();
  await saveScreen(page, "explorer-mixed-phone");
  await saveCard(page, "explorer-mixed-card-phone");
  const sideways = await page.evaluate<number>(
    "document.documentElement.scrollWidth - document.documentElement.clientWidth",
  );
  expect(sideways).toBeLessThanOrEqual(1);
});
