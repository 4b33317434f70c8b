/**
 * Sweep bands in the explorer: two rivals, ratio form r = 1, prize 100, Rival B's cost uniform
 * on [1, 3], Rival A's cost swept over 0.5, 0.75, 1. In each draw Rival A's equilibrium spend is
 * v c1 c2 / (c1 + c2)^2 (Hillman & Riley 1989), which falls in c2 on [1, 3] when c1 <= 1, so
 * its median at each swept c1 is the value at the median cost c2 = 2. The bands run in the Web
 * Worker with progress and cancel; the page's long tasks during the run are printed. The spend
 * bands download as a 1920 x 1080 slide.
 */
import { fillRivalBCostRange, openTwoRivalExplorer, runAndCancel } from "../support/explorer";
import { expect, test } from "../support/fixtures";
import {
  logLongTasks,
  resetLongTasks,
  traceMainThreadTasks,
  waitForTestIdQuietly,
  watchLongTasks,
} from "../support/longTasks";
import { parseShown } from "../support/numbers";
import { screensAtSizes, SIZES } from "../support/room";
import { expectPngSlide, expectSvgSlide } from "../support/slides";

const spendA = (c1: number, c2: number) => (100 * c1 * c2) / (c1 + c2) ** 2;

test("explorer sweep of a scenario with a range shows P10-P90 bands whose medians match the closed form, and cancels", async ({
  page,
  saveScreen,
}) => {
  await watchLongTasks(page);
  await page.setViewportSize(SIZES.laptop);
  await openTwoRivalExplorer(page);
  await page.getByTestId("range-toggle-rivals.1.cost").check();
  await fillRivalBCostRange(page, "1", "3");

  await page.getByTestId("sweep-param").selectOption("rivals.0.cost");
  await page.getByTestId("sweep-from").fill("0.5");
  await page.getByTestId("sweep-to").fill("1");
  await page.getByTestId("sweep-steps").fill("3");
  const bands = page.getByTestId("sweep-bands");

  // A long run shows progress and can be cancelled.
  await page.getByTestId("sweep-steps").fill("40");
  await runAndCancel(bands, "bands", "20000");

  await page.getByTestId("sweep-steps").fill("3");
  await bands.getByTestId("bands-draws").fill("4000");
  await resetLongTasks(page);
  // Traced too: on a loaded machine a task's wall time includes waiting for a core.
  const traced = await traceMainThreadTasks(page, async () => {
    await bands.getByTestId("bands-run").click();
    // Waited for in the page, not by polling expect: each miss of a polling expect takes an aria
    // snapshot of the whole page on its main thread, which would be recorded as a long task.
    await waitForTestIdQuietly(page, "bands-summary");
    // and the charts, so the trace covers drawing them
    await waitForTestIdQuietly(page, "bands-payoff-chart");
  });
  await expect(bands.getByTestId("bands-summary")).toContainText("3 values x 4,000 draws");
  const rows = bands.getByTestId("bands-table").locator("tbody tr");
  await expect(rows).toHaveCount(3);
  for (const [k, c1] of [0.5, 0.75, 1].entries()) {
    const cells = rows.nth(k).locator("td");
    expect(parseShown((await cells.nth(0).innerText()) ?? "").value).toBeCloseTo(c1, 9);
    const p10 = parseShown(await cells.nth(1).innerText()).value;
    const p50 = parseShown(await cells.nth(2).innerText()).value;
    const p90 = parseShown(await cells.nth(3).innerText()).value;
    // sampling error of the median at 4,000 draws is about 0.05 here; 0.3 leaves room
    expect(Math.abs(p50 - spendA(c1, 2)), `median spend of A at c1 = ${c1}`).toBeLessThan(0.3);
    // the spend falls in c2, so P10 sits near the value at c2's 90th percentile (2.8), P90 near 1.2
    expect(Math.abs(p10 - spendA(c1, 2.8))).toBeLessThan(0.3);
    expect(Math.abs(p90 - spendA(c1, 1.2))).toBeLessThan(0.3);
  }
  await logLongTasks(page, "sweep bands", traced);
  await saveScreen(page, "explorer-sweep-bands");
  // The spend bands as a 1920 x 1080 slide (PNG and SVG)
  await expectPngSlide(page, "bands-spend-chart-slide-png", "explorer-bands-spend.png");
  const { doc } = await expectSvgSlide(page, "bands-spend-chart-slide-svg");
  expect(doc.text[0]).toMatch(/^Equilibrium spend with its range as .* varies$/);
  expect(doc.text.join(" ")).toContain("median, shaded P10-P90");
  // The bands alone at each screen size, for looking at.
  await screensAtSizes(page, "explorer-sweep-bands", (file) => bands.screenshot({ path: file }));
});
