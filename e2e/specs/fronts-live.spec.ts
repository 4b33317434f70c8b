/**
 * A live session over several fronts (docs/protocol.md R45-R50): the facilitator starts the
 * roaster-districts template (three invented coffee-roaster chains, four districts, one
 * budget each; one chain played by the computer at the equilibrium), two people play two
 * rounds, one on a phone.
 *
 * What it proves:
 * - the seat form has one money input per front, shows the remaining budget as amounts are
 *   typed, and refuses to seal one cent over the budget (the engine's rule, checkAllocation);
 * - a sealed split shows on no other page before the reveal (positive control: the owner's);
 * - after each reveal the seat shows its results per front and in total with its best reply
 *   split, the console shows every front, the big screen one chart per front; the per-front
 *   shares shown equal the ratio-form share written out here from the revealed spends
 *   (Tullock 1980, with the demo's head starts);
 * - screenshots of seat, console and big screen at 1366x768, 1920x1080 and 390x844.
 */
import type { Page } from "@playwright/test";
import { exportJson } from "../support/api";
import { expect, test } from "../support/fixtures";
import { linkValue, pageText, phoneContext } from "../support/live";
import { expectAllInside, expectNoScroll, SIZES } from "../support/room";

const FRONTS = ["Old Town", "Harbourside", "University Quarter", "Riverside Park"];
/** the demo file's decisiveness per front and head starts per rival (rows rivals) */
const R = [1, 0.8, 0.6, 1];
const WEIGHT = [
  [1.4, 1, 1, 1],
  [1, 1, 1, 1],
  [1, 1, 1.3, 1.2],
];
const COST = [
  [1, 1.2, 1, 1.1],
  [1, 1, 1, 1],
  [1.8, 1, 0.8, 1],
];
/** Distinct splits (money) per round for seat 0 (budget 90,000) and seat 2 (budget 20,000). */
const PLAYED = [
  { 0: [41234.56, 20987.65, 14321.09, 5432.1], 2: [2345.67, 8765.43, 7654.32, 1234.58] },
  { 0: [50111.11, 15222.22, 9333.33, 7444.44], 2: [1555.55, 9666.66, 6777.77, 1999.99] },
] as const;

/** Ratio-form share p_ik = w_ik x_ik^r_k / sum_j w_jk x_jk^r_k, efforts x = spend / cost. */
function share(spends: readonly (readonly number[])[], i: number, k: number): number {
  const y = spends.map((row, j) => WEIGHT[j]![k]! * Math.pow(row[k]! / COST[j]![k]!, R[k]!));
  return y[i]! / y.reduce((a, b) => a + b, 0);
}

/** An amount as the screens write money to the cent, e.g. 41234.56 -> "41,234.56". */
const written = (x: number) =>
  x.toLocaleString("en-US", { minimumFractionDigits: 2, maximumFractionDigits: 2 });

/** Whether a page holds each amount, in its visible text or anywhere in its DOM. */
async function holds(page: Page, amounts: readonly number[]): Promise<boolean[]> {
  const text = `${await pageText(page)}\n${await page.content()}`;
  return amounts.map((x) => text.includes(written(x)) || text.includes(String(x)));
}

async function sealSplit(seat: Page, split: readonly number[], resolves = false) {
  for (const [k, x] of split.entries()) {
    await seat.getByTestId(`front-spend-input-${k}`).fill(String(x));
  }
  await expect(seat.getByTestId("seal-button")).toBeEnabled();
  await seat.getByTestId("seal-button").click();
  await expect(seat.getByTestId("seal-confirm")).toBeVisible();
  await seat.getByTestId("seal-confirm-button").click();
  await expect(seat.getByTestId("seal-confirm")).toBeHidden();
  if (!resolves) await expect(seat.getByTestId("seat-sealed-state")).toContainText("sealed");
}

async function shoot(
  page: Page,
  save: (p: Page, n: string) => Promise<void>,
  name: string,
  sizes: (keyof typeof SIZES)[] = ["laptop", "projector", "phone"],
) {
  for (const size of sizes) {
    await page.setViewportSize(SIZES[size]);
    // two animation frames: the layout of the new size has been painted
    await page.evaluate(
      () => new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done))),
    );
    await save(page, `fronts-${name}-${size}`);
  }
}

test("fronts session: template, two people over two rounds, results per front", async ({
  page,
  browser,
  baseURL,
  saveScreen,
}) => {
  await page.setViewportSize(SIZES.laptop);
  await page.goto("/");
  await page.getByTestId("start-template-roaster-districts").click();
  await expect(page.getByTestId("created-session")).toBeVisible();
  await expect(page.getByTestId("seat-computer-1")).toContainText("Textbook strategist");
  const facLink = await linkValue(page.getByTestId("facilitator-link"));
  const screenLink = await linkValue(page.getByTestId("screen-link"));
  const seatLinks = [
    await linkValue(page.getByTestId("seat-link-0")),
    await linkValue(page.getByTestId("seat-link-2")),
  ];
  const sessionId = facLink.split("/")[2]!.split("#")[0]!;

  const fac = page;
  await fac.goto(facLink);
  const screenCtx = await browser.newContext({ baseURL, viewport: SIZES.projector });
  const screen = await screenCtx.newPage();
  await screen.goto(screenLink);
  const seatCtx = await browser.newContext({ baseURL, viewport: SIZES.laptop });
  const ana = await seatCtx.newPage();
  await ana.goto(seatLinks[0]!);
  const phone = await phoneContext(browser, baseURL!);
  const ben = await phone.newPage();
  await ben.goto(seatLinks[1]!);
  await expect(ben.getByTestId("seat-fronts-terms")).toContainText("University Quarter");

  for (const [r, played] of PLAYED.entries()) {
    const round = r + 1;
    await fac.getByTestId("open-round").click();
    await expect(ana.getByTestId("front-spend-input-3")).toBeEnabled();
    await expect(ben.getByTestId("front-spend-input-0")).toBeEnabled();

    if (round === 1) {
      // one cent over the budget of 20,000: the form says so and will not seal
      for (const [k, x] of [5000, 5000, 5000, 5000.01].entries()) {
        await ben.getByTestId(`front-spend-input-${k}`).fill(String(x));
      }
      await expect(ben.getByTestId("fronts-remaining")).toContainText("over by");
      await expect(ben.getByTestId("fronts-problem")).toContainText("over your budget");
      await expect(ben.getByTestId("seal-button")).toBeDisabled();
      await ben.getByTestId("front-spend-input-3").fill("5000");
      await expect(ben.getByTestId("fronts-remaining")).toContainText("remaining");
      await expect(ben.getByTestId("seal-button")).toBeEnabled();
    }
    await sealSplit(ana, played[0]);
    if (round === 1) {
      await shoot(ana, saveScreen, "seat-sealed");
      await shoot(fac, saveScreen, "console-open");
      await shoot(screen, saveScreen, "screen-open");
      // hidden until the reveal: nobody else's page holds Ana's split; hers does
      for (const [p, who] of [
        [fac, "console"],
        [screen, "big screen"],
        [ben, "other seat"],
      ] as const) {
        expect(await holds(p, played[0]), who).toEqual([false, false, false, false]);
      }
      expect(await holds(ana, played[0]), "own seat").toEqual([true, true, true, true]);
    }
    await sealSplit(ben, played[2], true);
    await expect(ana.getByRole("heading", { name: `Round ${round} result` })).toBeVisible();

    // per front on every screen, against the share written out from the revealed spends
    const exported = (await exportJson(baseURL!, sessionId)) as {
      rounds: { fronts: { spends: number[][] } }[];
    };
    const spends = exported.rounds[r]!.fronts.spends;
    expect(spends[0]).toEqual([...played[0]]);
    const table = ana.getByTestId("seat-fronts-result");
    for (const [k, name] of FRONTS.entries()) {
      const row = table.getByRole("row", { name: new RegExp(`^${name}`) });
      const pct = (share(spends, 0, k) * 100).toFixed(1);
      await expect(row).toContainText(`${pct}%`);
    }
    await expect(ana.getByTestId("seat-best-reply")).not.toBeEmpty();
    await expect(ben.getByTestId("seat-fronts-result")).toContainText("Riverside Park");
    await expect(fac.getByTestId("console-round-per-front")).toContainText("Lantern Street Coffee");
    await expect(fac.getByTestId("console-round-totals")).toContainText("Bluebird Beanery");
    for (const k of [0, 1, 2, 3]) {
      await expect(screen.getByTestId(`screen-front-${k}`)).toContainText(FRONTS[k]!);
    }
    // the big screen holds every front without scrolling on a laptop and a projector
    for (const size of ["laptop", "projector"] as const) {
      await screen.setViewportSize(SIZES[size]);
      await expectNoScroll(screen, `big screen, round ${round}, ${size}`);
      await expectAllInside(screen, ".big-screen", `big screen, round ${round}, ${size}`);
    }
    if (round === 2) {
      await shoot(ana, saveScreen, "seat-revealed");
      await shoot(ben, saveScreen, "seat-phone-revealed", ["phone"]);
      await shoot(fac, saveScreen, "console-revealed");
      await shoot(screen, saveScreen, "screen-revealed");
    }
  }
  // the replay of the session so far opens and shows its events (totals over the fronts)
  await fac.setViewportSize(SIZES.laptop);
  await fac.getByRole("link", { name: "replay and printable debrief" }).click();
  await expect(fac).toHaveURL(new RegExp(`/replays/${sessionId}`));
  await expect(fac.getByTestId("replay-position")).toContainText("Event");
  await expect(fac.getByTestId("debrief-fronts")).toContainText("over 4 fronts");
  await shoot(fac, saveScreen, "replay", ["laptop"]);
  await screenCtx.close();
  await seatCtx.close();
  await phone.close();
});
