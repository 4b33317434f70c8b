/**
 * GET /api/sessions/:id/summary against numbers recomputed here from the stored event log: the
 * contest of each round-opened event, the efforts of round-resolved, and the solver's `solve`
 * and `respond` called directly (not the session engine's stored numbers).
 */
import { describe, expect, it } from "vitest";
import { normalize, respond, solve } from "@contend/solver";
import type { EventOf, SessionEvent } from "@contend/protocol";
import { sessionSummarySchema } from "@contend/protocol";
import { createManualClock } from "../src/clock";
import {
  command,
  createSessionOverHttp,
  eventLog,
  eventually,
  expectOk,
  hello,
  lastView,
  serverForFile,
} from "./helpers";
import { printShops } from "./fixtures";
import { hashKey } from "@contend/db";

const OPERATOR = "operator-secret-for-tests";
const clock = createManualClock();
const file = serverForFile({
  clock,
  operatorKeyDigest: Buffer.from(hashKey(OPERATOR), "hex"),
});

const bearer = (key: string) => ({ headers: { authorization: `Bearer ${key}` } });
const sum = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0);

/** Rounds of the log recomputed: money from each round's own costs, the equilibrium re-solved. */
function recompute(log: readonly SessionEvent[]) {
  const rounds: {
    round: number;
    seats: number[];
    spends: number[];
    eqSpends: number[];
    regrets: number[];
    bestSpends: number[];
    payoffs: number[];
    prize: number;
  }[] = [];
  let opened: EventOf<"round-opened"> | null = null;
  for (const e of log) {
    if (e.type === "round-opened") opened = e;
    if (e.type !== "round-resolved" || !opened) continue;
    const contest = normalize(opened.scenario);
    const efforts = opened.seatIndices.map((s) => e.efforts[s]!);
    const costs = opened.scenario.rivals.map((r) => r.cost);
    const eq = solve(contest).equilibrium;
    const eqEfforts = eq.efforts ?? eq.expectedEfforts!;
    const resp = respond(contest, efforts);
    rounds.push({
      round: e.round,
      seats: opened.seatIndices,
      spends: efforts.map((x, k) => costs[k]! * x),
      eqSpends: eqEfforts.map((x, k) => costs[k]! * x),
      regrets: resp.regrets,
      bestSpends: resp.bestResponses.map((x, k) => costs[k]! * x),
      payoffs: resp.payoffs,
      prize: opened.scenario.prize,
    });
  }
  return rounds;
}

describe("session summary", () => {
  it("rounds and seats match an independent computation from the event log", async () => {
    const created = await createSessionOverHttp(
      file.server.url,
      printShops({ rounds: 2, computer: { "Cobble Copy": { kind: "equilibrium" } } }),
    );
    const id = created.id;
    const fac = await file.client();
    const a = await file.client();
    const b = await file.client();
    expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
    expectOk(await hello(a, { role: "seat", sessionId: id, key: created.seats[0]!.key }));
    expectOk(await hello(b, { role: "seat", sessionId: id, key: created.seats[1]!.key }));
    const url = `${file.server.url}/api/sessions/${id}/summary`;

    expectOk(await command(fac, { type: "openRound" }));
    expectOk(await command(a, { type: "sealMove", clientMoveId: "1a", effort: 40 }));
    expectOk(await command(b, { type: "sealMove", clientMoveId: "1b", effort: 12.5 }));
    await eventually(() => expect(lastView(fac).rounds).toHaveLength(1));
    expectOk(await command(fac, { type: "noteRound", round: 1, text: "Inkwell went in hard" }));
    expectOk(
      await command(fac, { type: "applyShock", changes: [{ target: "prize", value: 150 }] }),
    );
    expectOk(await command(fac, { type: "openRound" }));
    expectOk(await command(a, { type: "sealMove", clientMoveId: "2a", effort: 30 }));

    // While round 2 is open, its sealed move is in no summary.
    const during = sessionSummarySchema.parse(await (await fetch(url, bearer(OPERATOR))).json());
    expect(during.rounds.map((r) => r.round)).toEqual([1]);
    expect(during.session.endedAt).toBeNull();

    expectOk(await command(b, { type: "sealMove", clientMoveId: "2b", effort: 20 }));
    await eventually(() => expect(lastView(fac).status).toBe("ended"));

    const res = await fetch(url, bearer(created.facilitatorKey));
    expect(res.status).toBe(200);
    const body: unknown = await res.json();
    const summary = sessionSummarySchema.strict().parse(body);
    expect(Object.keys(body as object)).toEqual(["session", "rounds", "seats"]);

    const log = await eventLog(file.server.db, id);
    const expected = recompute(log);
    expect(expected).toHaveLength(2);
    expect(summary.session).toMatchObject({
      id,
      title: printShops().title,
      currency: "EUR",
      tags: [],
    });
    expect(summary.session.createdAt).toBe(new Date(log[0]!.at).toISOString());
    expect(summary.session.endedAt).toBe(new Date(log.at(-1)!.at).toISOString());

    summary.rounds.forEach((r, i) => {
      const x = expected[i]!;
      expect(r.round).toBe(x.round);
      expect(r.totalSpend).toBeCloseTo(sum(x.spends), 9);
      expect(r.equilibriumTotalSpend).toBeCloseTo(sum(x.eqSpends), 6);
      expect(r.overspend).toBeCloseTo(sum(x.spends) / sum(x.eqSpends), 6);
      expect(r.nashGap).toBeCloseTo(Math.max(...x.regrets), 6);
      expect(r.dissipation).toBeCloseTo(sum(x.spends) / x.prize, 9);
      expect(r.prize).toBe(x.prize);
      expect(r.nashGapShare).toBeCloseTo(Math.max(...x.regrets) / x.prize, 6);
    });
    expect(summary.rounds.map((r) => r.prize)).toEqual([100, 150]);
    expect(summary.rounds.map((r) => r.note)).toEqual(["Inkwell went in hard", null]);
    // Round 1 by hand: 40 + 1.25 x 12.5 + Cobble Copy's spend.
    expect(summary.rounds[0]!.totalSpend).toBeCloseTo(40 + 15.625 + expected[0]!.spends[2]!, 9);
    expect(summary.rounds[0]!.shock).toBeNull();
    expect(summary.rounds[1]!.shock?.text).toBe("prize 100 -> 150");
    expect(summary.rounds[1]!.shock?.changes).toEqual([{ target: "prize", value: 150 }]);

    expect(summary.seats.map((s) => [s.seat, s.rival, s.kind, s.rounds])).toEqual([
      [0, "Inkwell Press", "person", 2],
      [1, "Foxglove Prints", "person", 2],
      [2, "Cobble Copy", "computer", 2],
    ]);
    summary.seats.forEach((s, seat) => {
      const k = (r: (typeof expected)[number]) => r.seats.indexOf(seat);
      const spends = expected.map((r) => r.spends[k(r)]!);
      const eqSpends = expected.map((r) => r.eqSpends[k(r)]!);
      expect(s.meanSpend).toBeCloseTo(sum(spends) / 2, 9);
      expect(s.meanEquilibriumSpend).toBeCloseTo(sum(eqSpends) / 2, 6);
      expect(s.overspend).toBeCloseTo(sum(spends) / sum(eqSpends), 6);
      expect(s.totalRegret).toBeCloseTo(sum(expected.map((r) => r.regrets[k(r)]!)), 6);
      expect(s.totalPayoff).toBeCloseTo(sum(expected.map((r) => r.payoffs[k(r)]!)), 6);
    });
    // Within 10% of the best reply's spend (cost x best-reply effort), per seat.
    summary.seats.forEach((s, seat) => {
      const near = expected.filter((r) => {
        const k = r.seats.indexOf(seat);
        return Math.abs(r.spends[k]! - r.bestSpends[k]!) <= 0.1 * r.bestSpends[k]!;
      }).length;
      expect(s.nearBestReply).toBeCloseTo(near / 2, 12);
    });
  });

  it("answers only the facilitator or operator key; unknown sessions are not found", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops());
    const url = `${file.server.url}/api/sessions/${created.id}/summary`;
    expect((await fetch(url)).status).toBe(401);
    // a seat or screen key gets the answer of an unknown id
    expect((await fetch(url, bearer(created.seats[0]!.key!))).status).toBe(404);
    expect((await fetch(url, bearer(created.spectatorKey))).status).toBe(404);
    expect((await fetch(url, bearer(created.facilitatorKey))).status).toBe(200);
    const empty = sessionSummarySchema.parse(await (await fetch(url, bearer(OPERATOR))).json());
    expect(empty.rounds).toEqual([]);
    expect(empty.seats.every((s) => s.meanSpend === null && s.overspend === null)).toBe(true);
    const missing = await fetch(`${file.server.url}/api/sessions/nope/summary`, bearer(OPERATOR));
    expect(missing.status).toBe(404);
    const post = await fetch(url, { method: "POST", ...bearer(OPERATOR) });
    expect(post.status).toBe(405);
  });
});
