/**
 * Calibrate journey: the invented demo panel is fitted in the browser, its scenario goes to the
 * editor with the calibration kept as provenance, and a session created from it shows that
 * provenance in the debrief. Bad data shows one message naming the row and column.
 */
import { readFile } from "node:fs/promises";
import { exportJson } from "../support/api";
import { expect, test } from "../support/fixtures";
import { connectSession } from "../support/session";

const NAMES = ["Larkspur Bakehouse", "Millstone Loaves", "Hearth & Crumb", "Copperpan Patisserie"];

test("calibrate(demo) -> estimates with intervals, charts, cautions -> editor keeps the provenance", async ({
  page,
  saveScreen,
}) => {
  await page.goto("/calibrate");
  await expect(page.getByTestId("calibrate-empty")).toBeVisible();
  await page.getByTestId("load-demo").click();
  await expect(page.getByTestId("calibrate-r")).toContainText(/0\.\d{3} \(0\.\d{3} to 0\.\d{3}\)/);
  await expect(page.getByTestId("calibrate-counts")).toHaveText("48 / 12 / 0");
  const table = page.getByTestId("calibrate-table");
  for (const name of NAMES) await expect(table).toContainText(name);
  await expect(page.getByTestId("calibrate-head-0")).toHaveText("1.000");
  await expect(page.getByTestId("calibrate-value-1")).toContainText("€");
  for (let i = 0; i < 4; i++)
    await expect(page.getByTestId(`calibrate-share-chart-${i}`)).toBeVisible();
  await expect(page.getByTestId("calibrate-residual-chart")).toBeVisible();
  await expect(page.getByTestId("calibrate-cautions")).toContainText("best replies");
  await expect(page.getByTestId("calibrate-cautions")).toContainText(
    "Jia, Skaperdas & Vaidya 2013",
  );
  await saveScreen(page, "calibrate");

  // The grid shows the same rows; an edit there refits.
  await page.getByTestId("mode-grid").click();
  await expect(page.getByTestId("grid-0-rival")).toHaveValue(NAMES[0]!);
  await page.getByTestId("grid-1-spend").fill("lots");
  await expect(page.getByTestId("calibrate-error")).toHaveText(
    'row 3, column spend: is not a number (got "lots")',
  );
  await expect(page.getByTestId("calibrate-input-error")).toHaveText(
    'row 3, column spend: is not a number (got "lots")',
  );
  await page.getByTestId("grid-1-spend").fill("19600");
  await expect(page.getByTestId("calibrate-r")).toBeVisible();

  await page.getByTestId("use-in-editor").click();
  await expect(page).toHaveURL(/\/new\?s=/);
  const note = page.getByTestId("editor-provenance");
  await expect(note).toContainText("Calibrated from data");
  await expect(note).toContainText("regional-bakeries.csv");
  await expect(page.getByTestId("rival-1-name")).toHaveValue(NAMES[1]!);
  await expect(page.getByTestId("rival-1-cost")).toHaveValue("1");
});

test("a session from a calibrated scenario shows its calibration in the debrief", async ({
  page,
  baseURL,
  saveScreen,
}) => {
  await page.goto("/calibrate");
  await page.getByTestId("load-demo").click();
  await expect(page.getByTestId("calibrate-r")).toBeVisible();
  const [file] = await Promise.all([
    page.waitForEvent("download"),
    page.getByTestId("download-scenario").click(),
  ]);
  const scenario = JSON.parse(await readFile((await file.path())!, "utf8")) as Record<
    string,
    unknown
  >;
  expect(scenario.provenance).toMatchObject({
    kind: "calibration",
    source: "regional-bakeries.csv",
  });

  const origin = baseURL!;
  const computer = Object.fromEntries(NAMES.map((n) => [n, { kind: "equilibrium" }]));
  const session = await connectSession(origin, {
    ...scenario,
    session: { rounds: 1, spendStep: 1, computer },
  });
  const { created } = session;
  const fac = session.facilitator;
  try {
    await fac.command({ type: "openRound" });
    await expect
      .poll(
        async () =>
          (
            (await exportJson(origin, created.id, created.facilitatorKey)) as {
              session: { status: string };
            }
          ).session.status,
      )
      .toBe("ended");
  } finally {
    session.close();
  }
  await page.goto(`/replays/${created.id}#key=${created.facilitatorKey}`);
  const note = page.getByTestId("debrief-provenance");
  await expect(note).toContainText("Calibrated from data");
  await expect(note).toContainText("48 observations in 12 periods");
  await expect(note).toContainText("These are estimates from past data, not facts.");
  await saveScreen(page, "calibrate-debrief");
});

test("calibrate on a phone: no sideways scrolling of the page", async ({ browser, baseURL }) => {
  const context = await browser.newContext({
    viewport: { width: 390, height: 844 },
    baseURL: baseURL!,
  });
  const page = await context.newPage();
  await page.goto("/calibrate");
  await page.getByTestId("load-demo").click();
  await expect(page.getByTestId("calibrate-r")).toBeVisible();
  // a string, evaluated in the page (this package's types have no DOM)
  const width = (await page.evaluate("document.documentElement.scrollWidth")) as number;
  expect(width).toBeLessThanOrEqual(390);
  await context.close();
});
