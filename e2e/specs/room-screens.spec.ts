/// <reference lib="dom" />
/// <reference lib="dom.iterable" />
/**
 * The room's screens through a whole session: the big screen fits 1366x768 and 1920x1080 with
 * no scrolling and no site chrome, says "Round n open, k of m sealed", "Paused" and, after the
 * end, the final standings; the facilitator console's main button always names the true next
 * step, its round length shows the real setting, each seat shows whether its page is online,
 * the coming round's equilibrium is previewed; round axes have one tick per round. Every main
 * screen passes axe (no serious or critical violation) and is saved at the three sizes.
 */
import type { Page } from "@playwright/test";
import type { CreatedSession } from "../support/api";
import { connectAs } from "../support/client";
import { expect, test } from "../support/fixtures";
import { pathOf } from "../support/live";
import {
  expectAccessible,
  expectAllInside,
  expectNoScroll,
  SIZES,
  startRoom,
  xTicks,
} from "../support/room";

type SizeName = keyof typeof SIZES;

async function shoot(
  page: Page,
  saveScreen: (p: Page, n: string) => Promise<void>,
  name: string,
  sizes: readonly SizeName[] = ["laptop", "projector", "phone"],
) {
  for (const s of sizes) {
    await page.setViewportSize(SIZES[s]);
    await saveScreen(page, `${name}-${SIZES[s].width}x${SIZES[s].height}`);
  }
  await page.setViewportSize(SIZES.laptop);
}

async function bigScreenFits(page: Page, what: string) {
  for (const s of ["laptop", "projector"] as const) {
    await page.setViewportSize(SIZES[s]);
    await expect(page.getByTestId("screen-headline")).toBeVisible();
    await expectNoScroll(page, `${what} at ${SIZES[s].width}x${SIZES[s].height}`);
    await expectAllInside(page, ".big-screen", `${what} at ${SIZES[s].width}x${SIZES[s].height}`);
  }
}

test("big screen and facilitator console through a 3-round session", async ({
  browser,
  baseURL,
  saveScreen,
}) => {
  const origin = baseURL!;
  const room = await startRoom(origin, 3);
  const { created } = room;
  const ctx = await browser.newContext({ baseURL: origin, viewport: SIZES.laptop });
  const screen = await ctx.newPage();
  const fac = await ctx.newPage();
  try {
    await screen.goto(pathOf(created.links.spectator));
    await fac.goto(pathOf(created.links.facilitator));

    // Lobby. No site menu on the big screen; the console says what comes next.
    await expect(screen.getByTestId("screen-headline")).toHaveText("Waiting to start");
    await expect(screen.getByRole("navigation", { name: "Main" })).toBeHidden();
    await bigScreenFits(screen, "big screen in the lobby");
    const main = fac.getByTestId("open-round");
    await expect(main).toHaveText("Open round 1 of 3");
    await expect(fac.getByTestId("open-duration")).toHaveValue("90");
    await expect(fac.locator("#coming-title")).toHaveText("Equilibrium for round 1", {
      useInnerText: true,
    });
    await expect(fac.getByTestId("console-eq-effort-0")).not.toHaveText("\u2013");
    // The two people's seats have a page connected (the bare clients); the console says so.
    await expect(fac.getByTestId("seat-presence-0")).toHaveAttribute("data-presence", "online");
    room.seats[1]!.close();
    await expect(fac.getByTestId("seat-presence-1")).toHaveAttribute("data-presence", "offline");
    room.seats[1] = await reconnectSeat(origin, created, 1);
    await expect(fac.getByTestId("seat-presence-1")).toHaveAttribute("data-presence", "online");
    await expectAccessible(fac, "facilitator console (lobby)");
    await expectAccessible(screen, "big screen (lobby)");

    // Round 1 opened from the console: the screen says how many sealed.
    await main.click();
    await expect(screen.getByTestId("screen-headline")).toHaveText("Round 1 open");
    await expect(screen.getByTestId("screen-detail")).toHaveText("1 of 3 sealed");
    await expect(main).toHaveText("Close round 1 and reveal");
    await expect(fac.getByTestId("live-announcement")).toHaveText("Round 1 is open.");
    await room.seats[0]!.command({ type: "sealMove", clientMoveId: "r1-s0", spend: 12.34 });
    await expect(screen.getByTestId("screen-detail")).toHaveText("2 of 3 sealed");
    await bigScreenFits(screen, "big screen, round open");
    await shoot(screen, saveScreen, "big-screen-round-open", ["laptop", "projector"]);
    await shoot(fac, saveScreen, "console-round-open");

    // Paused: large on the screen, and the console's main button resumes.
    await fac.getByTestId("pause").click();
    await expect(screen.getByTestId("screen-headline")).toHaveText("Paused");
    await expect(main).toHaveText("Resume");
    const size = await screen
      .getByTestId("screen-headline")
      .evaluate((el) => parseFloat(getComputedStyle(el).fontSize));
    expect(size, "Paused is large type").toBeGreaterThanOrEqual(40);
    await bigScreenFits(screen, "big screen, paused");
    await shoot(screen, saveScreen, "big-screen-paused", ["laptop"]);
    await main.click();
    await expect(main).toHaveText("Close round 1 and reveal");
    await room.seats[1]!.command({ type: "sealMove", clientMoveId: "r1-s1", spend: 7.89 });
    await expect(screen.getByTestId("screen-headline")).toHaveText("Round 1 revealed");
    await expect(main).toHaveText("Open round 2 of 3");
    await expect(fac.getByTestId("latest-result")).toContainText("round 1");
    await bigScreenFits(screen, "big screen, round revealed");
    await expectAccessible(screen, "big screen (revealed)");
    await shoot(screen, saveScreen, "big-screen-revealed", ["laptop", "projector"]);

    // Two more rounds over the socket; the last one ends the session.
    await room.playRound(2, [15.02, 9.41]);
    await room.playRound(3, [10.77, 11.63]);
    await expect(screen.getByTestId("screen-headline")).toHaveText("Final standings");
    await expect(screen.getByTestId("screen-summary")).toContainText("3 rounds played");
    await expect(screen.getByTestId("screen-totals").locator("tbody tr")).toHaveCount(3);
    await bigScreenFits(screen, "big screen, final standings");
    await expectAccessible(screen, "big screen (ended)");
    await shoot(screen, saveScreen, "big-screen-final", ["laptop", "projector"]);

    // After the end no button offers another round.
    await expect(main).toHaveText("Session ended");
    await expect(main).toBeDisabled();
    await expect(fac.getByTestId("end-session")).toHaveCount(0);

    // Round axes: one tick per round, at desktop and phone widths.
    for (const s of ["laptop", "phone"] as const) {
      await fac.setViewportSize(SIZES[s]);
      await expect(fac.getByTestId("console-history-effort-chart")).toBeVisible();
      await expect.poll(() => xTicks(fac, "console-history-effort-chart")).toEqual(["1", "2", "3"]);
    }
    await fac.setViewportSize(SIZES.laptop);
    await expectAccessible(fac, "facilitator console (ended)");
    await shoot(fac, saveScreen, "console-ended");

    // Console exports download (the tab stays on the console) with named files.
    const consoleUrl = fac.url();
    const [json] = await Promise.all([
      fac.waitForEvent("download"),
      fac.getByTestId("console-export-json").click(),
    ]);
    expect(json.suggestedFilename()).toMatch(
      /^library-reprint-order-three-print-shops-\d{4}-\d{2}-\d{2}\.json$/,
    );
    expect(fac.url()).toBe(consoleUrl);
    await expect(fac.getByTestId("open-round")).toBeVisible();
  } finally {
    room.close();
    await ctx.close();
  }
});

function reconnectSeat(origin: string, created: CreatedSession, i: number) {
  return connectAs(origin, { role: "seat", sessionId: created.id, key: created.seats[i]!.key! });
}
