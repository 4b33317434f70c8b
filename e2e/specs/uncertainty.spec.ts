/**
 * Uncertainty journey in the explorer: two rivals, ratio form r = 1, prize 100, Rival A's cost 1
 * and Rival B's cost a range, uniform on [1, 3]. Each draw's equilibrium spend of A is
 * v c1 c2 / (c1 + c2)^2 (Hillman & Riley 1989), which falls in c2 on [1, 3], so its median is
 * the value at the median cost c2 = 2: 200/9 = 22.22. The run happens in a Web Worker with
 * progress and cancel; a bad range names its field and blocks the run. The spend fan downloads
 * as a 1920 x 1080 slide.
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
import { expectPngSlide, expectSvgSlide } from "../support/slides";

test("explorer uncertainty(c2 ~ U[1, 3]) shows the median spend of the closed form, cancels, and names a bad range", async ({
  page,
  saveScreen,
}) => {
  // Long tasks (> 50 ms) the page's main thread runs (Long Tasks API).
  await watchLongTasks(page);
  await openTwoRivalExplorer(page);

  const section = page.getByTestId("uncertainty-section");
  await page.getByTestId("range-toggle-rivals.1.cost").check();

  // A bad range names the field inside it and the run is blocked.
  await fillRivalBCostRange(page, "3", "1");
  await expect(page.getByTestId("range-error")).toContainText("rivals.1.cost.high");
  await expect(section.getByTestId("uncertain-run")).toBeDisabled();
  await fillRivalBCostRange(page, "1", "3");
  await expect(page.getByTestId("range-error")).toHaveCount(0);

  // A long run shows progress and can be cancelled.
  await runAndCancel(section, "uncertain", "100000");

  await section.getByTestId("uncertain-draws").fill("10000");
  await resetLongTasks(page);
  // Traced too: on a loaded machine a task's wall time includes waiting for a core.
  const traced = await traceMainThreadTasks(page, async () => {
    await section.getByTestId("uncertain-run").click();
    // Waited for in the page, not by polling expect: each miss of a polling expect takes an aria
    // snapshot of the whole page on its main thread, which would be recorded as a long task.
    await waitForTestIdQuietly(page, "uncertain-status");
  });
  await expect(section.getByTestId("uncertain-status")).toContainText("10,000 draws (seed 1)");
  const shown = parseShown(await section.getByTestId("uncertain-median-spend-0").innerText());
  // sampling error of the median at 10,000 draws is about 0.03 here; 0.3 leaves room for rounding
  expect(Math.abs(shown.value - 200 / 9)).toBeLessThan(0.3);
  await expect(section.getByTestId("robust-plan")).toContainText("Rival A: spend");
  await expect(section.getByTestId("tornado-chart")).toContainText(
    "Cost per unit of effort, Rival B",
  );
  await logLongTasks(page, "uncertainty run", traced);
  await saveScreen(page, "explorer-uncertainty");

  // The spend fan as a 1920 x 1080 slide: one band per rival, drawn as SVG for the slide
  await expectPngSlide(page, "band-spend-slide-png", "explorer-fan-spend.png");
  const { svg, doc } = await expectSvgSlide(page, "band-spend-slide-svg");
  expect(doc.text[0]).toMatch(/^Spend \(.*\) at equilibrium: the range over the draws$/);
  expect(doc.text).toContain("Rival A");
  expect(svg.match(/fill-opacity="0.3"/g), "one P10-P90 band per rival").toHaveLength(2);
  // and the tornado, drawn as SVG for its slide
  await expectPngSlide(page, "tornado-chart-slide-png", "explorer-tornado.png");
  const { doc: tdoc } = await expectSvgSlide(page, "tornado-chart-slide-svg");
  expect(tdoc.text[0]).toMatch(/^Which unknown moves the payoff of Rival [AB] most$/);
  expect(tdoc.text.join(" ")).toContain("Cost per unit of effort, Rival B");

  // The link holds the ranges: a reload brings the range back.
  await expect
    .poll(() =>
      Buffer.from(new URL(page.url()).searchParams.get("s") ?? "", "base64url").toString(),
    )
    .toContain('"rg":{"rivals.1.cost"');
  await page.reload();
  await expect(page.getByTestId("range-toggle-rivals.1.cost")).toBeChecked();
  await expect(page.getByLabel("High of Cost per unit of effort, Rival B")).toHaveValue("3");
});
