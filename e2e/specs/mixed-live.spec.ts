/// <reference lib="dom" />
/**
 * A live round whose equilibrium is mixed: two identical rivals at decisiveness 3 have no pure
 * equilibrium (Baye, Kovenock & de Vries 1994), so each draws its spend at random. After the
 * reveal the seat's result, the facilitator's round table and the big screen show the expected
 * equilibrium spend and where the played spend falls: the chance that the equilibrium would
 * have spent less, which must equal the stored equilibrium's own points (from the export).
 * Screens saved at 1366x768, 1920x1080 and 390x844 (the big screen at the first two).
 */
import type { Page } from "@playwright/test";
import { exportJson } from "../support/api";
import { expect, test } from "../support/fixtures";
import { pathOf, sealSpend } from "../support/live";
import { expectAllInside, SIZES } from "../support/room";
import { connectSession } from "../support/session";

const NAMES = ["Harbour Lights Catering", "Millstone Kitchens"];

const scenario = {
  title: "Conference catering tender: two caterers",
  prize: 100,
  currency: "$",
  csf: { kind: "ratio", decisiveness: 3 },
  rivals: NAMES.map((name) => ({ name, cost: 1 })),
  leader: null,
  session: {
    outcome: "shares",
    spendStep: 0.01,
    rounds: 2,
    clockSeconds: 90,
    missingMove: "zero",
  },
};

type Exported = {
  rounds: {
    efforts: number[];
    equilibrium: {
      kind: string;
      strategies: { points: { effort: number; probability: number }[] }[];
    };
  }[];
};

/** "62.4%" -> 0.624 */
const percentOf = (text: string) => Number(text.replace(/[^\d.]/g, "")) / 100;

async function shoot(
  page: Page,
  saveScreen: (p: Page, n: string) => Promise<void>,
  name: string,
  sizes: readonly (keyof typeof SIZES)[],
) {
  for (const s of sizes) {
    await page.setViewportSize(SIZES[s]);
    await saveScreen(page, `${name}-${SIZES[s].width}x${SIZES[s].height}`);
  }
  await page.setViewportSize(SIZES.laptop);
}

test("a mixed round: seat, console and big screen place the spend in the equilibrium distribution", async ({
  browser,
  baseURL,
  saveScreen,
}) => {
  const origin = baseURL!;
  const session = await connectSession(origin, scenario, [1]);
  const { created } = session;
  const ctx = await browser.newContext({ baseURL: origin, viewport: SIZES.laptop });
  const seatPage = await ctx.newPage();
  const fac = await ctx.newPage();
  const screen = await ctx.newPage();
  try {
    await fac.goto(pathOf(created.links.facilitator));
    await screen.goto(pathOf(created.links.spectator));
    await seatPage.goto(pathOf(created.seats[0]!.link!));
    await fac.getByTestId("open-round").click();
    await sealSpend(seatPage, 30);
    await session.seats[0]!.command({ type: "sealMove", clientMoveId: "r1-s1", spend: 0 });
    // the last seal reveals the round
    await expect(screen.getByTestId("screen-headline")).toHaveText("Round 1 revealed");

    // the chance the equilibrium spends less than 30 (effort 30 at cost 1), from the export
    const round = ((await exportJson(origin, created.id)) as Exported).rounds[0]!;
    expect(round.equilibrium.kind).toBe("mixed");
    const below = round.equilibrium.strategies[0]!.points.filter((p) => p.effort < 30).reduce(
      (s, p) => s + p.probability,
      0,
    );

    const seatBelow = seatPage.getByTestId("seat-eq-below");
    await expect(seatBelow).toBeVisible();
    expect(Math.abs(percentOf(await seatBelow.innerText()) - below)).toBeLessThan(0.001);
    await expect(seatPage.getByTestId("seat-placement")).toContainText(
      /^At equilibrium your strategy draws a spend from \$0(\.00)? to \$[\d.,]+ \(expected \$[\d.,]+\): less than \$30(\.00)? with chance [\d.]+%/,
    );
    await expect(seatPage.getByTestId("seat-round-mixed-note")).toBeVisible();
    await shoot(seatPage, saveScreen, "mixed-live-seat", ["laptop", "projector", "phone"]);

    await expect(fac.getByTestId("console-round-mixed-note")).toBeVisible();
    await expect(fac.getByTestId("console-round-table")).toContainText(
      "Chance equilibrium spends less",
    );
    await shoot(fac, saveScreen, "mixed-live-console", ["laptop", "projector", "phone"]);

    const screenBelow = screen.getByTestId("screen-below-0");
    expect(Math.abs(percentOf(await screenBelow.innerText()) - below)).toBeLessThan(0.001);
    // spending nothing: the equilibrium never spends less than that
    await expect(screen.getByTestId("screen-below-1")).toHaveText("0%");
    for (const s of ["laptop", "projector"] as const) {
      await screen.setViewportSize(SIZES[s]);
      await expectAllInside(screen, ".big-screen", `big screen at ${SIZES[s].width}`);
    }
    await shoot(screen, saveScreen, "mixed-live-big-screen", ["laptop", "projector"]);
  } finally {
    session.close();
    await ctx.close();
  }
});
