/**
 * Replay journey: a finished session (played over the socket protocol, as any client would)
 * is stepped through event by event on /replays/[id]; at each reveal the page shows that
 * round's stored results, and the JSON and CSV downloads are byte-for-byte what the server's
 * export endpoint returns.
 */
import { readFile } from "node:fs/promises";
import type { Page } from "@playwright/test";
import { exportCsv, exportJson } from "../support/api";
import { expect, test } from "../support/fixtures";
import { ROOM_NAMES, roomScenario } from "../support/room";
import { connectSession, playRound } from "../support/session";
import { expectShown } from "../support/numbers";

const SCENARIO = roomScenario(3, { clockSeconds: null });
const PLAYED = [
  [12.34, 7.89],
  [15.02, 9.41],
  [10.77, 11.63],
];

interface ExportRound {
  round: number;
  efforts: number[];
  spends: number[];
  bestResponseSpends: number[];
  payoffs: number[];
  shares: number[];
  bestResponses: number[];
  regrets: number[];
  totals: number[];
  seatIndices: number[];
}
interface Exported {
  session: { id: string; title: string; status: string };
  events: { seq: number; type: string; round?: number }[];
  rounds: ExportRound[];
}

async function download(page: Page, testId: string): Promise<string> {
  const [file] = await Promise.all([
    page.waitForEvent("download"),
    page.getByTestId(testId).click(),
  ]);
  const path = await file.path();
  return readFile(path, "utf8");
}

test("replay(finished 3-round session) steps round by round and its downloads equal the server export", async ({
  page,
  baseURL,
  saveScreen,
}) => {
  const origin = baseURL!;
  const session = await connectSession(origin, SCENARIO, [0, 1]);
  const { created } = session;
  try {
    for (const [k, efforts] of PLAYED.entries()) {
      await playRound(
        origin,
        session,
        k + 1,
        efforts.map((effort) => ({ effort })),
      );
    }
  } finally {
    session.close();
  }
  await expect
    .poll(async () => ((await exportJson(origin, created.id)) as Exported).session.status)
    .toBe("ended");
  const exported = (await exportJson(origin, created.id)) as Exported;
  const csv = await exportCsv(origin, created.id);

  // The replay list names the sessions whose facilitator consoles this browser has opened,
  // and links to them: open the console once, then the list.
  await page.goto(`/facilitate/${created.id}#key=${created.facilitatorKey}`);
  await expect(page.getByRole("heading", { level: 1, name: SCENARIO.title })).toBeVisible();
  await page.goto("/replays");
  await expect(page.getByRole("heading", { name: "Past sessions" })).toBeVisible();
  await expect(page.getByTestId("replays-table")).toContainText(SCENARIO.title);
  await page.getByTestId(`replay-link-${created.id}`).click();
  await expect(page).toHaveURL(new RegExp(`/replays/${created.id}`));
  await expect(page.getByRole("heading", { level: 1, name: SCENARIO.title })).toBeVisible();

  const total = exported.events.length;
  await expect(page.getByTestId("replay-position")).toContainText(`Event ${total} of ${total}`);
  // Back to the first event, then forward one event at a time.
  while (await page.getByTestId("replay-prev").isEnabled())
    await page.getByTestId("replay-prev").click();
  await expect(page.getByTestId("replay-position")).toContainText(`Event 1 of ${total}`);
  await expect(page.getByTestId("replay-state")).toContainText("round 0 of 3");

  const revealedAt: number[] = [];
  for (let step = 1; step <= total; step++) {
    if (step > 1) await page.getByTestId("replay-next").click();
    await expect(page.getByTestId("replay-position")).toContainText(`Event ${step} of ${total}`);
    const event = exported.events[step - 1]!;
    if (event.type === "round-opened") {
      await expect(page.getByTestId("replay-state")).toContainText(`round ${event.round} of 3`);
      await expect(page.getByTestId("replay-round-table")).toHaveCount(0);
    }
    if (event.type !== "round-resolved") continue;
    revealedAt.push(step);
    const r = exported.rounds.find((x) => x.round === event.round)!;
    await expect(page.getByTestId("replay-position")).toContainText(`Round ${r.round} revealed`);
    const table = page.getByTestId("replay-round-table");
    for (const [row, seat] of r.seatIndices.entries()) {
      const cells = table.locator("tbody tr").nth(row);
      await expect(cells.locator('[data-col="name"]')).toHaveText(ROOM_NAMES[seat]!);
      await expectShown(
        cells.locator('[data-col="spend"]'),
        r.spends[row]!,
        `round ${r.round} ${ROOM_NAMES[seat]} spend`,
      );
      await expectShown(
        cells.locator('[data-col="payoff"]'),
        r.payoffs[row]!,
        `round ${r.round} ${ROOM_NAMES[seat]} payoff`,
      );
      await expectShown(
        cells.locator('[data-col="bestResponse"]'),
        r.bestResponseSpends[row]!,
        `round ${r.round} ${ROOM_NAMES[seat]} best reply`,
      );
      await expectShown(
        cells.locator('[data-col="total"]'),
        r.totals[row]!,
        `round ${r.round} ${ROOM_NAMES[seat]} total`,
      );
    }
    // The human efforts shown are the ones played.
    expect(r.efforts.slice(0, 2)).toEqual(PLAYED[r.round - 1]);
    if (r.round === 2) await saveScreen(page, "replay-round-2");
  }
  expect(revealedAt).toHaveLength(3);

  const json = JSON.parse(await download(page, "download-json")) as unknown;
  expect(json).toEqual(exported);
  expect(await download(page, "download-csv")).toBe(csv);
  // One CSV row per seat per round, after the header.
  expect(csv.trim().split(/\r?\n/)).toHaveLength(1 + 3 * 3);
});
