/**
 * Money journey: a seat decides an amount of money; the model's effort is spend / cost; the
 * budget caps money. A rival with cost 1.2 and a budget of €k200 seals €k180 (effort 150) and
 * its results say "You spent €k180" (the workshop run showed the effort, €k150, as the spend).
 * Screens of the seat at 1366x768 and 390x844 are saved as artifacts.
 */
import type { Browser, Page } from "@playwright/test";
import { exportJson } from "../support/api";
import { expect, test } from "../support/fixtures";
import { PHONE } from "../support/live";
import { expectShown } from "../support/numbers";
import { SIZES } from "../support/room";
import { connectSession, openPage } from "../support/session";

const COST = 1.2;
const SCENARIO = {
  title: "Two couriers bid for the harbour festival sponsorship",
  prize: 1000,
  currency: "\u20ack",
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "Quayside Couriers", cost: COST, budget: 200 },
    { name: "Tidewater Parcel Co-op", cost: 1 },
  ],
  leader: null,
  session: {
    outcome: "shares",
    spendStep: 1,
    rounds: 2,
    clockSeconds: null,
    missingMove: "zero",
    computer: { "Tidewater Parcel Co-op": { kind: "equilibrium" } },
  },
};

interface ExportRound {
  round: number;
  efforts: number[];
  spends: number[];
  bestResponses: number[];
  equilibrium: { efforts: number[] | null };
}

async function openSeat(browser: Browser, origin: string, link: string, phone: boolean) {
  const page = await openPage(browser, origin, link, phone ? "phone" : SIZES.laptop);
  await expect(page.getByRole("heading", { level: 1, name: "Quayside Couriers" })).toBeVisible();
  return page;
}

async function noSideScroll(page: Page, who: string) {
  // evaluated in the page, where `document` exists (this file is typed without the DOM)
  const wide = await page.evaluate(
    "document.documentElement.scrollWidth - document.documentElement.clientWidth",
  );
  expect(Number(wide), `${who} scrolls sideways`).toBeLessThanOrEqual(0);
}

test("seat(cost 1.2, budget €k200) seals €k180 as money and reads 'You spent €k180'", async ({
  browser,
  baseURL,
  saveScreen,
}) => {
  const origin = baseURL!;
  const session = await connectSession(origin, SCENARIO);
  const { created, facilitator: fac } = session;
  try {
    const link = created.seats[0]!.link!;
    const seat = await openSeat(browser, origin, link, false);
    // the terms are money: the cost is money per unit of effort, the budget is money
    await expect(seat.getByTestId("seat-cost")).toHaveText("\u20ack1.2");
    await expect(seat.getByTestId("seat-budget")).toHaveText("\u20ack200");
    await fac.command({ type: "openRound" });

    const input = seat.getByTestId("spend-input");
    await expect(input).toBeEnabled();
    // €k201 is over the budget (read as an effort cap, 200 would have allowed €k240)
    await input.fill("201");
    await expect(seat.getByTestId("spend-problem")).toContainText("Your budget is \u20ack200");
    await expect(seat.getByTestId("seal-button")).toBeDisabled();

    // off the €k1 grid: the offer is in the one money format ("Use €k180", not "Use 180.0")
    await input.fill("179.6");
    await expect(seat.getByTestId("spend-use-nearest")).toHaveText("Use \u20ack180");
    await seat.getByTestId("spend-use-nearest").click();
    await expect(input).toHaveValue("180");
    await seat.getByTestId("seal-button").click();
    const confirm = seat.getByTestId("seal-confirm");
    await expect(confirm).toContainText("Seal \u20ack180 for round 1");
    await expect(confirm).toContainText("buys 150 units of effort");
    await saveScreen(seat, "money-seat-confirm-1366");
    await seat.getByTestId("seal-confirm-button").click();

    // the computer sealed at opening, so this seal resolves the round
    await expect(seat.getByRole("heading", { name: "Round 1 result" })).toBeVisible();
    await expect(seat.getByTestId("seat-spend")).toHaveText("\u20ack180");
    await expect(seat.getByTestId("seat-result-text")).toContainText("You spent \u20ack180.");
    await expect(seat.locator("body")).not.toContainText("You spent \u20ack150");

    const exported = (await exportJson(origin, created.id)) as { rounds: ExportRound[] };
    const r = exported.rounds[0]!;
    expect(r.spends[0]).toBe(180);
    expect(r.efforts[0]).toBeCloseTo(150, 12);
    // equilibrium and best reply shown in money: cost x effort (the solver's efforts)
    await expectShown(
      seat.getByTestId("seat-eq-spend"),
      COST * r.equilibrium.efforts![0]!,
      "equilibrium spend",
    );
    await expectShown(
      seat.getByTestId("seat-best-reply"),
      COST * r.bestResponses[0]!,
      "best reply in money",
    );
    // the everyone-table's spend column agrees
    const row = seat.getByTestId("seat-round-table").locator("tbody tr").first();
    await expect(row.locator('[data-col="spend"]')).toHaveText("\u20ack180");
    await noSideScroll(seat, "seat at 1366");
    await saveScreen(seat, "money-seat-result-1366");

    const phone = await openSeat(browser, origin, link, true);
    expect(phone.viewportSize()).toEqual(PHONE);
    await expect(phone.getByTestId("seat-spend")).toHaveText("\u20ack180");
    await noSideScroll(phone, "seat at 390");
    await saveScreen(phone, "money-seat-result-390");
  } finally {
    session.close();
  }
});

test("shock(prize and cost) is announced on the seat, the big screen and the console, then listed", async ({
  browser,
  baseURL,
  saveScreen,
}) => {
  const origin = baseURL!;
  // seat 0 seals over the socket; its page, the big screen and the console show the results
  const session = await connectSession(origin, SCENARIO, [0]);
  const { created, facilitator: fac } = session;
  const seatClient = session.seats[0]!;
  try {
    const seat = await openPage(browser, origin, created.seats[0]!.link!, SIZES.laptop);
    const screen = await openPage(browser, origin, created.links.spectator, SIZES.projector);
    const console_ = await openPage(browser, origin, created.links.facilitator, SIZES.laptop);
    await expect(seat.getByRole("heading", { level: 1, name: "Quayside Couriers" })).toBeVisible();
    await expect(screen.getByTestId("big-screen")).toBeVisible();
    await expect(console_.getByTestId("session-status")).toBeVisible();
    const pages = { seat, "big screen": screen, console: console_ };

    // round 1 is played without a shock: no banner anywhere
    await fac.command({ type: "openRound" });
    await seatClient.command({ type: "sealMove", clientMoveId: "r1", spend: 150 });
    await expect(seat.getByRole("heading", { name: "Round 1 result" })).toBeVisible();
    for (const [who, page] of Object.entries(pages)) {
      await expect(page.getByTestId("shock-banner"), who).toHaveCount(0);
    }

    await fac.command({
      type: "applyShock",
      changes: [
        { target: "prize", value: 1500 },
        { target: "rival", index: 0, field: "cost", value: 1.5 },
      ],
    });
    for (const [who, page] of Object.entries(pages)) {
      const banner = page.getByTestId("shock-banner");
      await expect(banner, who).toBeVisible();
      await expect(banner, who).toContainText("The contest changes from round 2");
      await expect(banner, who).toContainText("Prize: \u20ack1,000 \u2192 \u20ack1,500");
      await expect(banner, who).toContainText(
        "Quayside Couriers: cost per unit of effort: \u20ack1.2 \u2192 \u20ack1.5",
      );
      // the banner sits in a polite live region, so screen readers announce it
      const live = page.getByTestId("shock-live");
      await expect(live, who).toHaveAttribute("role", "status");
      await expect(live, who).toHaveAttribute("aria-live", "polite");
      // and every role's live announcer says it once, in the same words
      await expect(page.getByTestId("live-announcement"), who).toContainText(
        "The contest changes from round 2: Prize: \u20ack1,000 \u2192 \u20ack1,500",
      );
    }
    await saveScreen(seat, "money-shock-seat-1366");
    await saveScreen(screen, "money-shock-big-screen-1920");
    await saveScreen(console_, "money-shock-console-1366");

    // it stays up while the changed round is open, and goes once that round is revealed
    await fac.command({ type: "openRound" });
    await expect(seat.getByTestId("shock-banner")).toContainText("(this round)");
    await expect(seat.getByTestId("live-announcement")).toHaveText("Round 2 is open.");
    // the same seat on a phone, with the banner and the amount box in the open round
    const phone = await openPage(browser, origin, created.seats[0]!.link!, "phone");
    await expect(phone.getByTestId("shock-banner")).toContainText("(this round)");
    await expect(phone.getByTestId("spend-input")).toBeEnabled();
    await noSideScroll(phone, "seat at 390 with a shock");
    await saveScreen(phone, "money-shock-seat-open-390");
    await seatClient.command({ type: "sealMove", clientMoveId: "r2", spend: 150 });
    await expect(seat.getByTestId("seat-ended")).toBeVisible();
    for (const [who, page] of Object.entries(pages)) {
      await expect(page.getByTestId("shock-banner"), who).toHaveCount(0);
    }
    // the debrief lists it, and the round axis marks the changed round
    const changes = console_.getByTestId("console-history-changes");
    await expect(changes).toContainText("From round 2: Prize: \u20ack1,000 \u2192 \u20ack1,500");
    await expect(seat.getByTestId("seat-history-chart")).toContainText("2 \u26a1");
    await expect(seat.getByTestId("seat-history-chart")).toContainText("changed");
    // a marked line on the round axis, named in the chart's label
    await expect(seat.getByTestId("seat-history-chart")).toHaveAttribute(
      "aria-label",
      /Marked: Round 2 \(changed\)/,
    );
    await saveScreen(seat, "money-shock-seat-ended-1366");
    // the export lists it too
    const exported = (await exportJson(origin, created.id)) as {
      shocks: { afterRound: number; changes: unknown[] }[];
    };
    expect(exported.shocks).toHaveLength(1);
    expect(exported.shocks[0]!.afterRound).toBe(1);
  } finally {
    session.close();
  }
});
