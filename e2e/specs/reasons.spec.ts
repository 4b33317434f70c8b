/**
 * Reasons journey (R26): a seat types a one-line reason with its spend, sees it beside its
 * sealed amount, and after the reveal the round's table lists it. Screens at 1366x768 and
 * 390x844 are saved as artifacts.
 */
import { expect, test } from "../support/fixtures";
import { pathOf } from "../support/live";
import { SIZES } from "../support/room";
import { connectSession, openPage } from "../support/session";

const SCENARIO = {
  title: "Two ferry operators bid for the island mail contract",
  prize: 500,
  currency: "EUR",
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "Gullwing Ferries", cost: 1 },
    { name: "Saltmarsh Boats", cost: 1 },
  ],
  leader: null,
  session: {
    outcome: "shares",
    spendStep: 1,
    rounds: 2,
    clockSeconds: null,
    missingMove: "zero",
    computer: {},
  },
};
const REASON = "Match last year's winning bid, no more";
const NOTE = "Both ferries stayed under the equilibrium spend";

test("a seat's reason is sealed with its spend and shown in the revealed round", async ({
  browser,
  baseURL,
  saveScreen,
}) => {
  const origin = baseURL!;
  // the facilitator and the other seat play over the socket; seat 0 is the page under test
  const session = await connectSession(origin, SCENARIO, [1]);
  const { created, facilitator: fac } = session;
  const other = session.seats[0]!;
  try {
    const link = pathOf(created.seats[0]!.link!);
    const seat = await openPage(browser, origin, link, SIZES.laptop);
    await expect(seat.getByRole("heading", { level: 1, name: "Gullwing Ferries" })).toBeVisible();
    await fac.command({ type: "openRound" });
    await expect(seat.getByTestId("spend-input")).toBeEnabled();
    await seat.getByTestId("spend-input").fill("120");
    await seat.getByTestId("reason-input").fill(REASON);
    await seat.getByTestId("seal-button").click();
    await seat.getByTestId("seal-confirm-button").click();
    await expect(seat.getByTestId("seat-sealed-reason")).toHaveText(REASON);
    await saveScreen(seat, "reasons-seat-sealed-1366");

    await other.command({ type: "sealMove", clientMoveId: "o1", spend: 90 });
    await expect(seat.getByRole("heading", { name: "Round 1 result" })).toBeVisible();
    const listed = seat.getByTestId("seat-round-reasons").locator("li");
    await expect(listed).toHaveCount(1);
    await expect(listed.first()).toHaveText(`Gullwing Ferries: ${REASON}`);
    await saveScreen(seat, "reasons-seat-result-1366");

    // The facilitator notes the round in the console; the seat reads the note with the round.
    const console_ = await openPage(browser, origin, created.links.facilitator, SIZES.laptop);
    await console_.getByTestId("round-note-input").fill(NOTE);
    await console_.getByTestId("round-note-save").click();
    await expect(console_.getByTestId("round-note-status")).toHaveText("Note saved.");
    await expect(console_.getByTestId("console-round-note")).toContainText(NOTE);
    await expect(seat.getByTestId("seat-round-note")).toContainText(NOTE);
    await console_.getByTestId("round-note-input").scrollIntoViewIfNeeded();
    await saveScreen(console_, "reasons-console-note-1366");

    const phone = await openPage(browser, origin, link, "phone");
    await expect(phone.getByTestId("seat-round-reasons")).toContainText(REASON);
    await expect(phone.getByTestId("seat-round-note")).toContainText(NOTE);
    await saveScreen(phone, "reasons-seat-result-390");
  } finally {
    session.close();
  }
});
