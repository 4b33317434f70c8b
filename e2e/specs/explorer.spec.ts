/**
 * Explorer journey: two rivals in a ratio contest with r = 1. The page must show the
 * equilibrium of Hillman & Riley (1989): e_i = v m_j / (m_1 + m_2)^2, and a sweep of rival 2's
 * cost must show rival 1's effort rising then falling, turning where the costs are equal. The
 * best-reply chart downloads as a 1920 x 1080 slide (PNG and SVG).
 */
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { expect, test } from "../support/fixtures";
import { expectShown } from "../support/numbers";
import { RESULTS_DIR } from "../support/server";
import { decodePng, download, parseSvg, pngSize } from "../support/slides";

/** Hillman & Riley (1989), two rivals, common value v, costs m1, m2, ratio form with r = 1. */
function hillmanRiley(v: number, m1: number, m2: number): [number, number] {
  const s = (m1 + m2) ** 2;
  return [(v * m2) / s, (v * m1) / s];
}

test("explorer(v=100, costs 5 and 2, r=1) shows the Hillman-Riley efforts and the turn of rival 1's effort at cost 5", async ({
  page,
  saveScreen,
}) => {
  await page.goto("/explore");
  await expect(page.getByRole("heading", { name: "Equilibrium explorer" })).toBeVisible();

  // Type every number the check depends on, whatever the page started with.
  await page.getByRole("textbox", { name: /^Prize/ }).fill("100");
  await page.getByLabel("Decisiveness r").fill("1");
  await page.getByLabel("Rival 1 name").fill("Rival A");
  await page.getByLabel("Rival 2 name").fill("Rival B");
  await page.getByLabel("Rival 1 cost").fill("3"); // a first value, then the real one: the page must recompute
  const [a3] = hillmanRiley(100, 3, 2);
  await expectShown(page.getByTestId("eq-effort-0"), a3, "e1 at m1=3");

  await page.getByLabel("Rival 1 cost").fill("5");
  await page.getByLabel("Rival 2 cost").fill("2");
  const [e1, e2] = hillmanRiley(100, 5, 2);
  // 100*2/49 = 4.0816..., 100*5/49 = 10.204...
  expect(e1).toBeCloseTo(4.0816, 4);
  expect(e2).toBeCloseTo(10.2041, 4);
  await expect(page.getByTestId("eq-kind")).toContainText("Pure-strategy equilibrium");
  await expectShown(page.getByTestId("eq-effort-0"), e1, "e1");
  await expectShown(page.getByTestId("eq-effort-1"), e2, "e2");
  // Shares p_i = e_i / (e_1 + e_2) = m_j / (m_1 + m_2): 2/7 and 5/7.
  await expectShown(page.getByTestId("eq-share-0"), 2 / 7, "p1", 100);
  await expectShown(page.getByTestId("eq-share-1"), 5 / 7, "p2", 100);
  // Payoffs u_i = v p_i^2 (Hillman & Riley 1989): 100*(2/7)^2 and 100*(5/7)^2.
  await expectShown(page.getByTestId("eq-payoff-0"), 100 * (2 / 7) ** 2, "u1");
  await expectShown(page.getByTestId("eq-payoff-1"), 100 * (5 / 7) ** 2, "u2");
  await saveScreen(page, "explorer-equilibrium");

  // The best-reply chart (drawn by hand, in its viewBox's units) as a 1920 x 1080 slide
  const png = await download(page, "reaction-chart-slide-png");
  expect(pngSize(png.bytes)).toEqual({ width: 1920, height: 1080 });
  expect((await decodePng(page, png.bytes)).ink, "the PNG has a drawing on it").toBeGreaterThan(
    0.01,
  );
  mkdirSync(path.join(RESULTS_DIR, "slides"), { recursive: true });
  writeFileSync(path.join(RESULTS_DIR, "slides", "explorer-best-replies.png"), png.bytes);
  const svg = await download(page, "reaction-chart-slide-svg");
  const doc = await parseSvg(page, svg.bytes.toString("utf8"));
  expect(doc).toMatchObject({ error: null, tag: "svg", width: "1920", height: "1080" });
  expect(doc.text[0]).toBe("Best replies of Rival A and Rival B");
  expect(doc.text).toContain("equilibrium");
  // the chart keeps its own coordinates, scaled as a whole
  expect(svg.bytes.toString("utf8")).toMatch(
    /<svg x="[\d.]+" y="[\d.]+" [^>]*viewBox="0 0 520 400"/,
  );

  // Sweep rival 2's cost over 1..10 in steps of 0.5.
  await page
    .getByRole("combobox", { name: "Parameter", exact: true })
    .selectOption({ label: "Cost of Rival B" });
  await page.getByRole("textbox", { name: "From", exact: true }).fill("1");
  await page.getByRole("textbox", { name: "To", exact: true }).fill("10");
  await page.getByRole("textbox", { name: "Points", exact: true }).fill("19");
  const run = page.getByTestId("sweep-run");
  await expect(run).toBeEnabled();
  await run.click();
  await expect(page.getByTestId("sweep-status")).toContainText("19 points");

  const table = page.getByTestId("sweep-table");
  await expect(table.locator("tbody tr")).toHaveCount(19);
  const xs = (await table.locator('td[data-col="x"]').allTextContents()).map(Number);
  const efforts = (await table.locator('td[data-col="effort0"]').allTextContents()).map(Number);
  expect(xs).toHaveLength(19);
  expect(xs[0]).toBe(1);
  expect(xs[18]).toBe(10);
  // Every point matches the closed form for (m1 = 5, m2 = x).
  xs.forEach((x, k) => {
    expect(efforts[k], `effort of rival A at cost ${x}`).toBeCloseTo(hillmanRiley(100, 5, x)[0], 4);
  });
  // Rising then falling, highest at x = 5 (d e1 / d m2 = v (m1 - m2) / (m1 + m2)^3).
  const peak = efforts.indexOf(Math.max(...efforts));
  expect(xs[peak]).toBe(5);
  for (let k = 1; k <= peak; k++) expect(efforts[k]!).toBeGreaterThan(efforts[k - 1]!);
  for (let k = peak + 1; k < efforts.length; k++) expect(efforts[k]!).toBeLessThan(efforts[k - 1]!);
  await expect(page.getByTestId("sweep-turns")).toHaveText(
    /Rival A's effort turns at 5(\.0+)?(?![.\d])/,
  );
  await saveScreen(page, "explorer-sweep");
});
