/**
 * The session editor in "several fronts" mode (docs/protocol.md R45-R50): a facilitator builds
 * a 2-front, 3-rival session in /new (invented bakeries over two districts) with one computer
 * seat and a round clock, creates it with the editor's usual button, lands on the console,
 * opens round 1, two people seal their splits, and the round resolves per front.
 *
 * What it proves:
 * - the switch shows the fronts tables and hides, each with one line saying why, the settings a
 *   session with fronts refuses (outcome draw, spend step, private numbers, shocks);
 * - a problem shows at its own cell with the protocol's message, and money headers carry the
 *   currency;
 * - the created session has the clock and the computer seat typed in the editor, and the
 *   computer's split is its row of the fronts equilibrium (R49);
 * - axe finds no serious or critical violation on the editor in fronts mode;
 * - screenshots of the editor at 1366x768, 1920x1080 and 390x844 (and with two problems), and
 *   no sideways scroll of the page at any of them.
 */
import type { Page } from "@playwright/test";
import { exportJson } from "../support/api";
import { expect, test } from "../support/fixtures";
import { linkValue } from "../support/live";
import { SIZES, expectAccessible } from "../support/room";

const FRONTS = [
  { name: "North Quarter", prize: "9000" },
  { name: "South Quarter", prize: "4500" },
];
const RIVALS = [
  { name: "Crumb & Co", budget: "3000" },
  { name: "Loaf Lane", budget: "2500" },
  { name: "Rye Works", budget: "2000" },
];
/** what the two people seal in round 1 (money per front, within their budgets) */
const SPLITS = [
  [1234.5, 876.25],
  [1500, 640.75],
];

async function shootAll(page: Page, save: (p: Page, n: string) => Promise<void>, name: string) {
  for (const size of ["laptop", "projector", "phone"] as const) {
    await page.setViewportSize(SIZES[size]);
    await page.evaluate(
      () => new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done))),
    );
    await save(page, `${name}-${size}`);
    // wide tables scroll inside their own box; the page itself never scrolls sideways
    const sideways = await page.evaluate(
      () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
    );
    expect(sideways, `editor at ${size}: sideways scroll (px)`).toBeLessThanOrEqual(0);
  }
  await page.setViewportSize(SIZES.laptop);
}

test("fronts session from /new: two fronts, three rivals, a computer seat, a clock, round 1 per front", async ({
  page,
  browser,
  baseURL,
  saveScreen,
}) => {
  const fac = page;
  await fac.setViewportSize(SIZES.laptop);
  await fac.goto("/new");
  await expect(fac.getByRole("radio", { name: "One contest, one prize" })).toBeChecked();
  await expect(fac.getByTestId("field-outcome")).toBeVisible();
  await fac.getByRole("radio", { name: "Several fronts, one budget per rival" }).check();

  // refused settings: gone, each with its reason
  await expect(fac.getByTestId("field-outcome")).toHaveCount(0);
  await expect(fac.getByTestId("field-spend-step")).toHaveCount(0);
  const reasons = fac.getByTestId("fronts-not-available");
  await expect(reasons).toContainText("drawing one winner is not available");
  await expect(reasons).toContainText("Private costs and values: not available");
  await expect(reasons).toContainText("Shocks during the session: not available");

  await fac.getByTestId("field-title").fill("Three bakeries over two districts");
  await fac.getByTestId("field-currency").fill("EUR");
  for (const [k, f] of FRONTS.entries()) {
    await fac.getByTestId(`front-${k}-name`).fill(f.name);
    await fac.getByTestId(`front-${k}-prize`).fill(f.prize);
  }
  const rivalsTable = fac.getByTestId("fronts-rivals-table");
  await expect(fac.getByTestId("fronts-table")).toContainText("Prize (EUR)");
  await expect(rivalsTable).toContainText("Budget (EUR)");
  if ((await rivalsTable.locator("tbody tr").count()) < 3)
    await fac.getByTestId("frival-add").click();
  await expect(rivalsTable.locator("tbody tr")).toHaveCount(3);
  for (const [i, r] of RIVALS.entries()) {
    await fac.getByTestId(`frival-${i}-name`).fill(r.name);
    await fac.getByTestId(`frival-${i}-budget`).fill(r.budget);
    await fac.getByTestId(`frival-${i}-cost-0`).fill("1");
    await fac.getByTestId(`frival-${i}-cost-1`).fill("1");
  }

  // a problem shows at its own cell, with the protocol's message in plain words
  await fac.getByTestId("front-1-prize").fill("-5");
  const prizeCell = fac.getByRole("cell").filter({ has: fac.getByTestId("front-1-prize") });
  await expect(prizeCell.locator(".field-error")).toContainText("Front 2 prize");
  await expect(fac.getByTestId("front-1-prize")).toHaveAttribute("aria-invalid", "true");
  await fac.getByTestId("frival-1-budget").fill("lots");
  await expect(fac.getByTestId("error-count")).toHaveText("2 fields to fix.");
  await saveScreen(fac, "new-fronts-editor-errors-laptop");
  // no equilibrium of earlier numbers while a field needs fixing
  await expect(fac.getByTestId("fronts-preview-table")).toHaveCount(0);
  await fac.getByTestId("front-1-prize").fill(FRONTS[1]!.prize);
  await fac.getByTestId("frival-1-budget").fill(RIVALS[1]!.budget);

  // who plays: only a person and the two computer players fronts take
  const policy = fac.getByTestId("frival-2-policy");
  await expect(policy.locator("option")).toHaveCount(3);
  await policy.selectOption("equilibrium");
  await fac.getByRole("textbox", { name: "Rounds", exact: true }).fill("2");
  await fac.getByRole("textbox", { name: /^Round clock/ }).fill("600");
  await expect(fac.getByTestId("error-count")).toHaveText("Ready.");
  await expect(fac.getByTestId("fronts-preview-table")).toContainText("Rye Works");

  await expectAccessible(fac, "session editor, fronts mode");
  await shootAll(fac, saveScreen, "new-fronts-editor");

  await fac.getByTestId("create-session").click();
  await expect(fac.getByTestId("created-session")).toBeVisible();
  await expect(fac.getByTestId("seat-computer-2")).toContainText("Textbook strategist");
  const seatLinks = [
    await linkValue(fac.getByTestId("seat-link-0")),
    await linkValue(fac.getByTestId("seat-link-1")),
  ];
  const facLink = await linkValue(fac.getByTestId("facilitator-link"));
  const sessionId = new URL(facLink, "http://placeholder").pathname.split("/")[2]!;
  await fac.getByTestId("open-facilitator").click();
  await expect(fac.getByTestId("session-status")).toBeVisible();

  const seats: Page[] = [];
  for (const link of seatLinks) {
    const ctx = await browser.newContext({ baseURL, viewport: SIZES.laptop });
    const seat = await ctx.newPage();
    await seat.goto(link);
    await expect(seat.getByTestId("seat-fronts-terms")).toContainText("South Quarter");
    seats.push(seat);
  }

  await fac.getByTestId("open-round").click();
  // the editor's clock runs: the console shows it
  await expect(fac.getByTestId("round-clock")).toBeVisible();
  for (const [i, seat] of seats.entries()) {
    for (const [k, x] of SPLITS[i]!.entries())
      await seat.getByTestId(`front-spend-input-${k}`).fill(String(x));
    await seat.getByTestId("seal-button").click();
    await seat.getByTestId("seal-confirm-button").click();
  }
  await expect(seats[0]!.getByRole("heading", { name: "Round 1 result" })).toBeVisible();

  const exported = (await exportJson(baseURL!, sessionId)) as {
    events: { type: string; scenario?: { session?: { clockSeconds?: number } } }[];
    rounds: { fronts: { spends: number[][]; equilibrium: { spends: number[][] | null } } }[];
  };
  const createdEvent = exported.events.find((e) => e.type === "session-created");
  expect(createdEvent?.scenario?.session?.clockSeconds).toBe(600);
  const fr = exported.rounds[0]!.fronts;
  expect(fr.spends[0]).toEqual(SPLITS[0]);
  expect(fr.spends[1]).toEqual(SPLITS[1]);
  // R49: the computer seat plays its row of the fronts equilibrium
  expect(fr.equilibrium.spends).not.toBeNull();
  for (const [k, x] of fr.equilibrium.spends![2]!.entries())
    expect(fr.spends[2]![k]).toBeCloseTo(x, 6);

  const result = seats[0]!.getByTestId("seat-fronts-result");
  for (const f of FRONTS) await expect(result).toContainText(f.name);
  const perFront = fac.getByTestId("console-round-per-front");
  for (const f of FRONTS) await expect(perFront).toContainText(f.name);
  await expect(perFront).toContainText("Rye Works");
  for (const seat of seats) await seat.context().close();
});

test("the fronts template's 'Edit first' opens the editor in fronts mode with its numbers", async ({
  page,
}) => {
  await page.setViewportSize(SIZES.laptop);
  await page.goto("/");
  await page
    .getByTestId("template-roaster-districts")
    .getByRole("link", { name: "Edit first" })
    .click();
  await expect(page).toHaveURL(/\/new\?template=roaster-districts/);
  await expect(
    page.getByRole("radio", { name: "Several fronts, one budget per rival" }),
  ).toBeChecked();
  await expect(page.getByTestId("fronts-table").locator("tbody tr")).toHaveCount(4);
  await expect(page.getByTestId("front-3-name")).toHaveValue("Riverside Park");
  await expect(page.getByTestId("frival-1-policy")).toHaveValue("equilibrium");
  await expect(page.getByRole("textbox", { name: /^Round clock/ })).toHaveValue("180");
  await expect(page.getByTestId("error-count")).toHaveText("Ready.");
  // back to one contest and again to fronts: the fronts typed so far are kept
  await page.getByTestId("front-0-prize").fill("170000");
  await page.getByRole("radio", { name: "One contest, one prize" }).check();
  await expect(page.getByTestId("fronts-table")).toHaveCount(0);
  await page.getByRole("radio", { name: "Several fronts, one budget per rival" }).check();
  await expect(page.getByTestId("front-0-prize")).toHaveValue("170000");
});
