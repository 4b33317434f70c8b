/**
 * A session as the journeys set one up: created over REST, its facilitator (and any seats)
 * connected over the socket protocol, rounds played by those clients; and pages opened on the
 * links the server gave.
 */
import type { Browser, Page } from "@playwright/test";
import { expect } from "@playwright/test";
import { createSession, exportJson } from "./api";
import type { CreatedSession } from "./api";
import { connectAs } from "./client";
import type { Participant } from "./client";
import { pathOf, phoneContext } from "./live";

export interface ConnectedSession {
  created: CreatedSession;
  facilitator: Participant;
  /** the seats connected, in the order they were asked for */
  seats: Participant[];
  /** closes every connection */
  close(): void;
}

/** Creates a session and connects its facilitator and the seats of `seatIndices`. */
export async function connectSession(
  origin: string,
  scenario: unknown,
  seatIndices: readonly number[] = [],
): Promise<ConnectedSession> {
  const created = await createSession(origin, scenario);
  const facilitator = await connectAs(origin, {
    role: "facilitator",
    sessionId: created.id,
    key: created.facilitatorKey,
  });
  const seats = await Promise.all(
    seatIndices.map((i) =>
      connectAs(origin, { role: "seat", sessionId: created.id, key: created.seats[i]!.key! }),
    ),
  );
  return {
    created,
    facilitator,
    seats,
    close() {
      facilitator.close();
      for (const s of seats) s.close();
    },
  };
}

/** A seat's move: money (the current form) or effort (the older form, still accepted). */
export type Move = { spend: number } | { effort: number };

/**
 * Plays round `round`: the facilitator opens it, each connected seat seals its move in order,
 * then waits until the server's export holds that round.
 */
export async function playRound(
  origin: string,
  session: ConnectedSession,
  round: number,
  moves: readonly Move[],
): Promise<void> {
  await session.facilitator.command({ type: "openRound" });
  for (const [i, seat] of session.seats.entries()) {
    await seat.command({ type: "sealMove", clientMoveId: `r${round}-s${i}`, ...moves[i] });
  }
  const id = session.created.id;
  await expect
    .poll(async () => ((await exportJson(origin, id)) as { rounds: unknown[] }).rounds.length)
    .toBe(round);
}

/**
 * A page in a browser context of its own, opened on a link the server gave (or a path), at a
 * viewport, or as a phone (390x844, touch; see phoneContext), or at the browser's default.
 */
export async function openPage(
  browser: Browser,
  origin: string,
  link: string,
  viewport?: { width: number; height: number } | "phone",
): Promise<Page> {
  const context =
    viewport === "phone"
      ? await phoneContext(browser, origin)
      : await browser.newContext({ baseURL: origin, ...(viewport ? { viewport } : {}) });
  const page = await context.newPage();
  await page.goto(pathOf(link));
  return page;
}
