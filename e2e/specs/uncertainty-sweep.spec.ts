/**
 * Sweep bands in the explorer: two rivals, ratio form r = 1, prize 100, Rival B's cost uniform
 * on [1, 3], Rival A's cost swept over 0.5, 0.75, 1. In each draw Rival A's equilibrium spend is
 * v c1 c2 / (c1 + c2)^2 (Hillman & Riley 1989), which falls in c2 on [1, 3] when c1 <= 1, so
 * its median at each swept c1 is the value at the median cost c2 = 2. The bands run in the Web
 * Worker with progress and cancel; the page's long tasks during the run are printed. The spend
 * bands download as a 1920 x 1080 slide.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { loadavg } from "node:os";
import { expect, test } from "../support/fixtures";
import {
  readLongTasks,
  resetLongTasks,
  traceMainThreadTasks,
  waitForTestIdQuietly,
  watchLongTasks,
} from "../support/longTasks";
import { parseShown } from "../support/numbers";
import { SIZES } from "../support/room";
import { RESULTS_DIR } from "../support/server";
import { decodePng, download, parseSvg, pngSize } from "../support/slides";

const spendA = (c1: number, c2: number) => (100 * c1 * c2) / (c1 + c2) ** 2;

test("explorer sweep of a scenario with a range shows P10-P90 bands whose medians match the closed form, and cancels", async ({
  page,
  saveScreen,
}) => {
  await watchLongTasks(page);
  await page.setViewportSize(SIZES.laptop);
  await page.goto("/explore");
  await page.getByRole("textbox", { name: /^Prize/ }).fill("100");
  await page.getByLabel("Decisiveness r").fill("1");
  await page.getByLabel("Rival 1 name").fill("Rival A");
  await page.getByLabel("Rival 2 name").fill("Rival B");
  await page.getByLabel("Rival 1 cost").fill("1");
  await page.getByLabel("Rival 2 cost").fill("2");
  await page.getByTestId("range-toggle-rivals.1.cost").check();
  await page.getByLabel("Low of Cost per unit of effort, Rival B").fill("1");
  await page.getByLabel("High of Cost per unit of effort, Rival B").fill("3");

  await page.getByTestId("sweep-param").selectOption("rivals.0.cost");
  await page.getByTestId("sweep-from").fill("0.5");
  await page.getByTestId("sweep-to").fill("1");
  await page.getByTestId("sweep-steps").fill("3");
  const bands = page.getByTestId("sweep-bands");

  // A long run shows progress and can be cancelled.
  await page.getByTestId("sweep-steps").fill("40");
  await bands.getByTestId("bands-draws").fill("20000");
  await bands.getByTestId("bands-run").click();
  await expect(bands.getByTestId("bands-progress")).toBeVisible();
  await bands.getByTestId("bands-cancel").click();
  await expect(bands.getByTestId("bands-cancelled")).toBeVisible();

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
  const longTasks = await readLongTasks(page);
  console.log(
    `sweep bands: long tasks on the page (ms): ${JSON.stringify(longTasks)} at load ${loadavg()[0]!.toFixed(1)}; ` +
      `traced tasks over 50 ms (wall/CPU ms): ${JSON.stringify(traced.long.map((t) => `${t.wall}/${t.cpu}`))}, ` +
      `largest task CPU ${traced.maxCpu} ms`,
  );
  await saveScreen(page, "explorer-sweep-bands");
  // The spend bands as a 1920 x 1080 slide (PNG and SVG)
  const png = await download(page, "bands-spend-chart-slide-png");
  expect(pngSize(png.bytes)).toEqual({ width: 1920, height: 1080 });
  expect((await decodePng(page, png.bytes)).ink, "the PNG has a drawing on it").toBeGreaterThan(
    0.01,
  );
  mkdirSync(path.join(RESULTS_DIR, "slides"), { recursive: true });
  writeFileSync(path.join(RESULTS_DIR, "slides", "explorer-bands-spend.png"), png.bytes);
  const doc = await parseSvg(
    page,
    (await download(page, "bands-spend-chart-slide-svg")).bytes.toString("utf8"),
  );
  expect(doc).toMatchObject({ error: null, tag: "svg", width: "1920", height: "1080" });
  expect(doc.text[0]).toMatch(/^Equilibrium spend with its range as .* varies$/);
  expect(doc.text.join(" ")).toContain("median, shaded P10-P90");
  // The bands alone at each screen size, for looking at.
  const dir = path.join(RESULTS_DIR, "screens");
  mkdirSync(dir, { recursive: true });
  for (const size of [SIZES.laptop, SIZES.projector, SIZES.phone]) {
    await page.setViewportSize(size);
    await bands.screenshot({
      path: path.join(dir, `explorer-sweep-bands-${size.width}x${size.height}.png`),
    });
  }
});
