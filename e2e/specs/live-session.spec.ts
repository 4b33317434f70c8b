/**
 * Live-session journey: a facilitator creates a session from a template, three people take
 * seats (two by seat link, one on a phone by join code) beside one computer-played rival, and
 * they play three rounds with a cost shock before round 3.
 *
 * What it proves:
 * - each seat sees its own payoff, share, best reply (in money) and regret, equal (at the
 *   precision shown) to what the solver computes for the spends typed (effort = spend / cost);
 *   the round's Nash gap too;
 * - before a round is revealed, no other participant's page shows a sealed effort, and no
 *   socket frame sent to anyone but its owner carries it (the owner's frames do: the recorder
 *   would catch a leak);
 * - the big screen shows who has sealed, then the reveal.
 */
import type { Page } from "@playwright/test";
import { normalize, respond, shares } from "@contend/solver";
import type { Scenario } from "@contend/solver";
import { exportJson } from "../support/api";
import { expect, test } from "../support/fixtures";
import { framesBeforeReveal, framesCarrying, recordFrames, type Frame } from "../support/frames";
import {
  expectNotShown,
  expectShownAll,
  linkValue,
  phoneContext,
  sealSpend,
} from "../support/live";
import { expectShown } from "../support/numbers";

const NAMES = ["Larkspur Bakehouse", "Millstone Loaves", "Hearth Lane Bakery", "Oven Row Bakery"];
const COMPUTER = 2;
const HUMANS = [0, 1, 3];
/** Distinct spends per round (two decimals, below 10, so every screen shows them as typed). */
const PLAYED: Record<number, number>[] = [
  { 0: 7.43, 1: 8.91, 3: 6.17 },
  { 0: 5.38, 1: 9.26, 3: 4.79 },
  { 0: 6.84, 1: 3.57, 3: 8.12 },
];
const COSTS = [1, 1.25, 1.6, 2];
const SHOCKED_COST = 1.5; // rival 1's cost from round 3 on

function scenarioFor(round: number): Scenario {
  return {
    title: "Four bakeries bid for the station kiosk lease",
    prize: 100,
    currency: "$",
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: NAMES.map((name, i) => ({
      name,
      cost: i === 0 && round >= 3 ? SHOCKED_COST : COSTS[i]!,
    })),
    leader: null,
  };
}

interface Participant {
  page: Page;
  frames: Frame[];
  who: string;
  /** seat index, or null for the facilitator and the big screen */
  seat: number | null;
}

test("live session(3 people + 1 computer, 3 rounds, shock before round 3) shows solver numbers and keeps sealed moves private", async ({
  browser,
  baseURL,
  saveScreen,
}) => {
  test.setTimeout(300_000);
  const origin = baseURL!;

  // --- the facilitator builds the session from a template ---------------------------------
  const facContext = await browser.newContext({ baseURL: origin });
  const fac = await facContext.newPage();
  const facFrames = recordFrames(fac);
  await fac.goto("/");
  await fac.getByTestId("template-kiosk-lease").getByRole("link", { name: "Edit first" }).click();
  await expect(fac.getByRole("heading", { name: "New session" })).toBeVisible();
  await expect(fac.getByRole("textbox", { name: "Rival 1 name", exact: true })).toHaveValue(
    NAMES[0]!,
  );
  await fac.getByRole("textbox", { name: "Title", exact: true }).fill(scenarioFor(1).title);
  await fac.getByRole("textbox", { name: /^Prize/ }).fill("100");
  await fac.getByRole("textbox", { name: /^Currency/ }).fill("$");
  await fac.getByTestId("add-rival").click();
  await fac.getByRole("textbox", { name: "Rival 4 name", exact: true }).fill(NAMES[3]!);
  for (let i = 0; i < 4; i++) {
    await fac
      .getByRole("textbox", { name: `Rival ${i + 1} cost`, exact: true })
      .fill(String(COSTS[i]));
  }
  await expect(fac.getByRole("combobox", { name: "Rival 3 played by" })).toHaveValue("equilibrium");
  await expect(fac.getByRole("combobox", { name: "Rival 4 played by" })).toHaveValue("human");
  await fac.getByRole("radio", { name: "Prize shared by winning chance" }).check();
  await fac.getByRole("textbox", { name: /^Spend step/ }).fill("0.01");
  await fac.getByRole("textbox", { name: "Rounds", exact: true }).fill("3");
  await fac.getByRole("textbox", { name: /^Round clock/ }).fill("");
  await expect(fac.getByTestId("error-count")).toHaveText("Ready.");
  await saveScreen(fac, "new-session-editor");
  await fac.getByTestId("create-session").click();
  const created = fac.getByTestId("created-session");
  await expect(created).toBeVisible();

  const joinCode = ((await fac.getByTestId("join-code").textContent()) ?? "").trim();
  expect(joinCode).not.toBe("");
  const seatLinks = [
    await linkValue(fac.getByTestId("seat-link-0")),
    await linkValue(fac.getByTestId("seat-link-1")),
  ];
  await expect(fac.getByTestId(`seat-computer-${COMPUTER}`)).toContainText("computer");
  const screenLink = await linkValue(fac.getByTestId("screen-link"));
  const facLink = await linkValue(fac.getByTestId("facilitator-link"));
  const sessionId = new URL(facLink, "http://placeholder").pathname.split("/")[2]!;
  await fac.goto(facLink);
  await expect(fac.getByTestId("session-status")).toBeVisible();

  // --- big screen and seats ------------------------------------------------------------------
  const screenPage = await (
    await browser.newContext({ baseURL: origin, viewport: { width: 1600, height: 900 } })
  ).newPage();
  const screenFrames = recordFrames(screenPage);
  await screenPage.goto(screenLink);
  await expect(screenPage.getByTestId("big-screen")).toBeVisible();

  const seats: Record<number, Participant> = {};
  for (const i of [0, 1]) {
    const page = await (await browser.newContext({ baseURL: origin })).newPage();
    const frames = recordFrames(page);
    await page.goto(seatLinks[i]!);
    await expect(page.getByRole("heading", { level: 1, name: NAMES[i] })).toBeVisible();
    seats[i] = { page, frames, who: `seat ${i}`, seat: i };
  }
  // The phone user joins with the code alone.
  const phone = await (await phoneContext(browser, origin)).newPage();
  const phoneFrames = recordFrames(phone);
  await phone.goto("/join");
  await phone.getByRole("textbox", { name: "Join code", exact: true }).fill(joinCode);
  await phone.getByTestId("join-find").click();
  await phone.getByTestId("join-seat-3").check();
  await phone.getByRole("textbox", { name: /^Your name/ }).fill("Robin");
  await saveScreen(phone, "join-phone");
  await phone.getByTestId("join-claim").click();
  await expect(phone).toHaveURL(/\/seat\//);
  await expect(phone.getByRole("heading", { level: 1, name: NAMES[3] })).toBeVisible();
  seats[3] = { page: phone, frames: phoneFrames, who: "seat 3 (phone)", seat: 3 };

  const everyone: Participant[] = [
    { page: fac, frames: facFrames, who: "facilitator", seat: null },
    { page: screenPage, frames: screenFrames, who: "big screen", seat: null },
    ...HUMANS.map((i) => seats[i]!),
  ];

  for (let round = 1; round <= 3; round++) {
    const played = PLAYED[round - 1]!;

    if (round === 3) {
      // Shock between rounds: rival 1's cost rises.
      await fac.getByTestId("shock-target").selectOption("rival");
      await fac
        .getByRole("combobox", { name: "Rival", exact: true })
        .selectOption({ label: NAMES[0]! });
      await fac.getByTestId("shock-field").selectOption("cost");
      await fac.getByTestId("shock-value").fill(String(SHOCKED_COST));
      await fac.getByTestId("shock-add").click();
      await expect(fac.getByTestId("shock-pending")).toContainText(NAMES[0]!);
      await fac.getByTestId("shock-apply").click();
      await expect(fac.getByTestId("shock-history")).toContainText(NAMES[0]!);
      await expectShown(
        seats[0]!.page.getByTestId("seat-cost"),
        SHOCKED_COST,
        "seat 0 cost after the shock",
      );
    }

    await fac.getByTestId("open-round").click();
    for (const i of HUMANS) await expect(seats[i]!.page.getByTestId("spend-input")).toBeEnabled();
    // The computer seals when the round opens.
    await expect(fac.getByTestId(`seat-sealed-${COMPUTER}`)).toHaveAttribute("data-sealed", "yes");

    const sealedSoFar: number[] = [];
    for (const [k, i] of HUMANS.entries()) {
      await sealSpend(seats[i]!.page, played[i]!, k === HUMANS.length - 1);
      sealedSoFar.push(played[i]!);
      if (k === HUMANS.length - 1) break; // the last seal resolves the round
      await expect(fac.getByTestId(`seat-sealed-${i}`)).toHaveAttribute("data-sealed", "yes");
      await expect(screenPage.getByTestId(`screen-seat-${i}`)).toHaveAttribute(
        "data-sealed",
        "yes",
      );
      if (round === 1 && k === 0) {
        await saveScreen(fac, "facilitator-round-open");
        await saveScreen(seats[0]!.page, "seat-sealed");
      }
      for (const p of everyone) {
        const others = HUMANS.filter((j) => j !== p.seat && sealedSoFar.includes(played[j]!)).map(
          (j) => played[j]!,
        );
        await expectNotShown(p.page, others, `${p.who} in round ${round}`);
      }
    }

    // --- reveal ----------------------------------------------------------------------------
    for (const i of HUMANS) {
      await expect(
        seats[i]!.page.getByRole("heading", { name: `Round ${round} result` }),
      ).toBeVisible();
    }
    // The last reveal ends the session: the big screen then leads with the final standings.
    await expect(
      screenPage.getByRole("heading", {
        name: round < PLAYED.length ? `Round ${round} revealed` : "Final standings",
        exact: true,
      }),
    ).toBeVisible();

    const exported = (await exportJson(origin, sessionId)) as {
      rounds: { round: number; efforts: number[]; spends: number[] }[];
    };
    const stored = exported.rounds.find((r) => r.round === round);
    expect(stored, `export has round ${round}`).toBeTruthy();
    // Seats type money; the model's effort is spend / cost.
    const contest = normalize(scenarioFor(round));
    const costs = contest.rivals.map((r) => r.cost);
    const efforts = [0, 1, 2, 3].map((i) =>
      i === COMPUTER ? stored!.efforts[COMPUTER]! : played[i]! / costs[i]!,
    );
    for (const i of HUMANS) {
      expect(stored!.spends[i]).toBe(played[i]!);
      expect(stored!.efforts[i]).toBeCloseTo(efforts[i]!, 12);
    }

    const reference = respond(contest, efforts);
    const refShares = shares(contest, efforts);
    for (const i of HUMANS) {
      const page = seats[i]!.page;
      const label = `round ${round} seat ${i}`;
      await expectShown(page.getByTestId("seat-payoff"), reference.payoffs[i]!, `${label} payoff`);
      await expectShown(page.getByTestId("seat-share"), refShares[i]!, `${label} share`, 100);
      await expectShown(
        page.getByTestId("seat-best-reply"),
        costs[i]! * reference.bestResponses[i]!,
        `${label} best reply`,
      );
      await expectShown(page.getByTestId("seat-regret"), reference.regrets[i]!, `${label} regret`);
      await expectShown(page.getByTestId("seat-round-gap"), reference.nashGap, `${label} Nash gap`);
      // After the reveal everyone's efforts are public: the same check that passed above now finds them.
      await expectShownAll(
        page,
        HUMANS.map((j) => played[j]!),
        `${label} after reveal`,
      );
    }
    await expectShownAll(
      screenPage,
      HUMANS.map((j) => played[j]!),
      `big screen round ${round}`,
    );
    if (round === 1) {
      await saveScreen(screenPage, "big-screen-reveal");
      await saveScreen(seats[1]!.page, "seat-result-desktop");
      await saveScreen(phone, "seat-result-phone");
    }

    // --- no frame carried someone else's sealed effort before the reveal ------------------
    for (const p of everyone) {
      const before = framesBeforeReveal(p.frames, round);
      expect(
        before.length,
        `${p.who} received frames before round ${round} was revealed`,
      ).toBeGreaterThan(0);
      for (const j of HUMANS) {
        // the spend typed and the effort it buys (spend / cost) are both private
        const costJ = scenarioFor(round).rivals[j]!.cost;
        const carrying = framesCarrying(before, [played[j]!, played[j]! / costJ]);
        if (p.seat === j && j !== HUMANS[HUMANS.length - 1]) {
          // (the last sealer's move resolves the round, so its next view is already the reveal)
          expect(carrying.length, `${p.who} got its own sealed effort back`).toBeGreaterThan(0);
        } else if (p.seat !== j) {
          expect(
            carrying.map((f) => f.raw.slice(0, 300)),
            `${p.who} received seat ${j}'s effort before the reveal`,
          ).toEqual([]);
        }
      }
    }
  }

  await saveScreen(fac, "facilitator-after-round-3");
  // The last of the planned rounds ends the session for everyone.
  await expect(fac.getByTestId("session-status")).toHaveText("Session ended");
  for (const i of HUMANS) await expect(seats[i]!.page.getByTestId("seat-ended")).toBeVisible();
});
