/**
 * Resilience journey on a server of its own (fresh data directory): a seat closes its page
 * mid-round and comes back to its sealed move; then the server process is killed (SIGKILL,
 * no shutdown hooks) mid-round, and again right after the last seal of a round is acknowledged,
 * and started again on the same data directory and port each time. Every
 * acknowledged move survives, the pages reconnect by themselves and the session goes on.
 */
import type { Page } from "@playwright/test";
import { normalize, respond } from "@contend/solver";
import type { Scenario } from "@contend/solver";
import { createSession, exportJson } from "../support/api";
import { expect, test } from "../support/fixtures";
import { pathOf, sealSpend } from "../support/live";
import { expectShown } from "../support/numbers";
import { ServerProcess } from "../support/server";
import { openPage } from "../support/session";

const SCENARIO: Scenario & { session: Record<string, unknown> } = {
  title: "Three bakeries bid for the station kiosk lease",
  prize: 100,
  currency: "$",
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "Larkspur Bakehouse", cost: 1 },
    { name: "Millstone Loaves", cost: 1.25 },
    { name: "Hearth Lane Bakery", cost: 1.6 },
  ],
  leader: null,
  session: {
    outcome: "shares",
    effortStep: 0.01,
    rounds: 3,
    clockSeconds: null,
    missingMove: "zero",
    computer: { "Hearth Lane Bakery": { kind: "equilibrium" } },
  },
};

interface Exported {
  events: { seq: number; type: string }[];
  rounds: { round: number; efforts: number[]; spends: number[]; payoffs: number[] }[];
}

test.describe.configure({ timeout: 300_000 });

test("seat page closed and reopened, then server killed and restarted mid-round: sealed moves kept, session goes on", async ({
  browser,
  saveScreen,
}) => {
  const server = new ServerProcess({ name: "resilience" });
  await server.start();
  try {
    const origin = server.baseURL;
    const created = await createSession(origin, SCENARIO);
    const seatLink = (i: number) => pathOf(created.seats[i]!.link!);
    const open = (path: string): Promise<Page> => openPage(browser, origin, path);

    const fac = await open(pathOf(created.links.facilitator));
    await expect(fac.getByTestId("session-status")).toHaveText("Waiting to start");
    let seat0 = await open(seatLink(0));
    const seat1 = await open(seatLink(1));
    await expect(
      seat0.getByRole("heading", { level: 1, name: "Larkspur Bakehouse" }),
    ).toBeVisible();
    await expect(seat1.getByRole("heading", { level: 1, name: "Millstone Loaves" })).toBeVisible();

    // --- round 1: close and reopen a seat page --------------------------------------------
    await fac.getByTestId("open-round").click();
    await sealSpend(seat0, 7.43);
    await expect(fac.getByTestId("seat-sealed-0")).toHaveAttribute("data-sealed", "yes");
    const seat0Context = seat0.context();
    await seat0.close();
    seat0 = await seat0Context.newPage();
    await seat0.goto(seatLink(0));
    await expect(seat0.getByTestId("seat-sealed-amount")).toHaveText(/7\.43$/);
    await expect(seat0.getByTestId("spend-input")).toBeEnabled();
    await saveScreen(seat0, "resilience-seat-reopened");

    // --- kill the server with one move acknowledged and one still to come ----------------
    const before = (await exportJson(origin, created.id)) as Exported;
    const seqBefore = Math.max(...before.events.map((e) => e.seq));
    await server.stop("SIGKILL");
    for (const page of [fac, seat0, seat1]) {
      await expect(page.getByTestId("connection-banner")).toHaveAttribute(
        "data-status",
        "reconnecting",
      );
    }
    await saveScreen(seat1, "resilience-server-down");
    await server.start();
    expect(server.starts).toBe(2);

    // Pages reconnect on their own, on the same address, and pick up where they were.
    for (const page of [fac, seat0, seat1]) {
      await expect(page.getByTestId("connection-banner")).toHaveAttribute(
        "data-status",
        /^(live|resynced)$/,
        {
          timeout: 60_000,
        },
      );
    }
    await expect(seat0.getByTestId("seat-sealed-amount")).toHaveText(/7\.43$/);
    await expect(fac.getByTestId("seat-sealed-0")).toHaveAttribute("data-sealed", "yes");
    await expect(fac.getByTestId("seat-sealed-1")).toHaveAttribute("data-sealed", "no");
    const after = (await exportJson(origin, created.id)) as Exported;
    // Round 1 is still open, so its sealed moves stay out of the export; what was there is kept.
    expect(after.events.slice(0, before.events.length)).toEqual(before.events);

    await sealSpend(seat1, 8.91, true);
    await expect(seat1.getByRole("heading", { name: "Round 1 result" })).toBeVisible();
    await expect(seat0.getByRole("heading", { name: "Round 1 result" })).toBeVisible();

    const round1 = (await exportJson(origin, created.id)) as Exported;
    const r1 = round1.rounds.find((r) => r.round === 1)!;
    // seats type money; the engine's effort is spend / cost (Millstone's cost is 1.25)
    expect(r1.spends.slice(0, 2)).toEqual([7.43, 8.91]);
    expect(r1.efforts[1]).toBeCloseTo(8.91 / 1.25, 12);
    const reference = respond(normalize(SCENARIO), r1.efforts);
    await expectShown(
      seat0.getByTestId("seat-payoff"),
      reference.payoffs[0]!,
      "seat 0 payoff after restart",
    );
    await expectShown(
      seat1.getByTestId("seat-payoff"),
      reference.payoffs[1]!,
      "seat 1 payoff after restart",
    );

    // --- the session goes on: round 2 on the restarted server -----------------------------
    await fac.getByTestId("open-round").click();
    await sealSpend(seat0, 5.38);
    await sealSpend(seat1, 9.26, true);
    // Kill again the moment the last seal is acknowledged: the move is committed, and the
    // round either resolved already or must resolve when the server restores the session.
    await server.restart("SIGKILL");
    expect(server.starts).toBe(3);
    await expect(seat0.getByRole("heading", { name: "Round 2 result" })).toBeVisible({
      timeout: 60_000,
    });
    await expect(seat1.getByRole("heading", { name: "Round 2 result" })).toBeVisible();
    await expect(fac.getByTestId("session-status")).toHaveText("Round revealed");
    const final = (await exportJson(origin, created.id)) as Exported;
    expect(final.rounds.map((r) => r.round)).toEqual([1, 2]);
    expect(final.rounds[1]!.spends.slice(0, 2)).toEqual([5.38, 9.26]);
    // One unbroken event log: 1, 2, 3, ... with nothing lost or duplicated across the restart.
    const seqs = final.events.map((e) => e.seq);
    expect(seqs).toEqual(seqs.map((_, k) => k + 1));
    expect(Math.max(...seqs)).toBeGreaterThan(seqBefore);
    await saveScreen(fac, "resilience-facilitator-after-restart");
  } finally {
    await server.dispose();
  }
});
