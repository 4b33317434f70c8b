/// <reference lib="dom" />
/// <reference lib="dom.iterable" />
/**
 * Helpers for the room-readiness journeys: a session played over the socket protocol, the
 * three screen sizes, the no-scroll check, the accessibility scan and the print geometry.
 */
import { mkdirSync } from "node:fs";
import path from "node:path";
import AxeBuilder from "@axe-core/playwright";
import type { Page } from "@playwright/test";
import { expect } from "@playwright/test";
import { connectSession, playRound } from "./session";
import type { ConnectedSession } from "./session";
import { RESULTS_DIR } from "./server";

export const SIZES = {
  laptop: { width: 1366, height: 768 },
  projector: { width: 1920, height: 1080 },
  phone: { width: 390, height: 844 },
} as const;

/**
 * Screenshots at the laptop, projector and phone sizes, in that order, as
 * test-results/screens/<name>-<width>x<height>.png: `shoot` takes each (of the viewport, or of
 * one element) into the file it is given. The viewport is left at the phone size.
 */
export async function screensAtSizes(
  page: Page,
  name: string,
  shoot: (file: string) => Promise<unknown>,
): Promise<void> {
  const dir = path.join(RESULTS_DIR, "screens");
  mkdirSync(dir, { recursive: true });
  for (const size of [SIZES.laptop, SIZES.projector, SIZES.phone]) {
    await page.setViewportSize(size);
    await shoot(path.join(dir, `${name}-${size.width}x${size.height}.png`));
  }
}

export const ROOM_NAMES = ["Quarry Road Print", "Inkwell Press", "Foxglove Copy Shop"];

/** Three invented print shops; the third is a computer seat playing the equilibrium. */
export function roomScenario(rounds = 3, session: Record<string, unknown> = {}) {
  return {
    title: "Library reprint order: three print shops",
    prize: 100,
    currency: "$",
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: [
      { name: ROOM_NAMES[0], cost: 1 },
      { name: ROOM_NAMES[1], cost: 1.5 },
      { name: ROOM_NAMES[2], cost: 1.2 },
    ],
    leader: null,
    session: {
      outcome: "shares",
      spendStep: 0.01,
      rounds,
      clockSeconds: 90,
      missingMove: "zero",
      computer: { [ROOM_NAMES[2]!]: { kind: "equilibrium" } },
      ...session,
    },
  };
}

export interface PlayedRoom extends ConnectedSession {
  /** plays one round: opens it, seals both people's spends, waits for the reveal */
  playRound(round: number, spends: readonly [number, number]): Promise<void>;
}

export async function startRoom(origin: string, rounds = 3): Promise<PlayedRoom> {
  const session = await connectSession(origin, roomScenario(rounds), [0, 1]);
  return {
    ...session,
    playRound: (round, spends) =>
      playRound(
        origin,
        session,
        round,
        spends.map((spend) => ({ spend })),
      ),
  };
}

/** The page needs no scrolling in either direction at its current viewport. */
export async function expectNoScroll(page: Page, what: string): Promise<void> {
  const size = await page.evaluate(() => {
    const el = document.scrollingElement ?? document.documentElement;
    return {
      scrollW: el.scrollWidth,
      scrollH: el.scrollHeight,
      w: window.innerWidth,
      h: window.innerHeight,
    };
  });
  expect(size.scrollH, `${what}: page height against the viewport`).toBeLessThanOrEqual(size.h);
  expect(size.scrollW, `${what}: page width against the viewport`).toBeLessThanOrEqual(size.w);
}

/** Every element of the big screen that holds text ends inside the viewport (nothing cut off below). */
export async function expectAllInside(page: Page, selector: string, what: string): Promise<void> {
  const outside = await page.evaluate((sel) => {
    const root = document.querySelector(sel);
    if (!root) return ["(no root)"];
    const bad: string[] = [];
    for (const el of root.querySelectorAll("h1, h2, th, td, li, p, span")) {
      const r = el.getBoundingClientRect();
      if (r.width === 0 || r.height === 0) continue;
      if (r.bottom > window.innerHeight + 0.5 || r.right > window.innerWidth + 0.5) {
        bad.push(
          `${el.tagName} "${(el.textContent ?? "").slice(0, 30)}" ends at ${Math.round(r.right)}x${Math.round(r.bottom)}`,
        );
      }
    }
    return bad;
  }, selector);
  expect(outside, `${what}: elements outside the viewport`).toEqual([]);
}

/** axe-core (WCAG 2.x A and AA rules) finds no serious or critical violation. */
export async function expectAccessible(page: Page, what: string): Promise<void> {
  const result = await new AxeBuilder({ page })
    .withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"])
    .analyze();
  const bad = result.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map(
      (v) =>
        `${v.id} (${v.impact}): ${v.help} at ${v.nodes
          .map((n) => n.target.join(" "))
          .slice(0, 3)
          .join(" | ")}`,
    );
  expect(bad, `${what}: serious or critical accessibility violations`).toEqual([]);
}

/** Text of the tick labels of a chart's x axis. */
export async function xTicks(page: Page, chartTestId: string): Promise<string[]> {
  return page
    .getByTestId(chartTestId)
    .locator(".recharts-xAxis-tick-labels .recharts-cartesian-axis-tick-value")
    .allTextContents();
}
