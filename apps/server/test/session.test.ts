import { describe, expect, it, vi } from "vitest";
import { normalize, respond, solve } from "@contend/solver";
import type { RoleView } from "@contend/protocol";
import { apply, initialState } from "@contend/session";
import { createApplication } from "../src/app";
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
import { getWithKey } from "./helpers";
import { printShops } from "./fixtures";

const clock = createManualClock();
const file = serverForFile({ clock });
const client = file.client;

function roundsOf(view: RoleView) {
  return view.rounds;
}

describe("a full live session over sockets", () => {
  it("three rounds with a computer seat and a shock before round 3 match the solver, and export the log", async () => {
    const created = await createSessionOverHttp(
      file.server.url,
      printShops({ computer: { "Cobble Copy": { kind: "equilibrium" } } }),
    );
    expect(created.seats.map((s) => s.kind)).toEqual(["human", "human", "computer"]);
    expect(created.seats[2]!.key).toBeNull();
    const id = created.id;

    const fac = await client();
    const seat0 = await client();
    const seat1 = await client();
    const screen = await client();
    const facHello = expectOk(
      await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }),
    );
    expect(facHello.role).toBe("facilitator");
    expect(facHello.view.status).toBe("lobby");
    const s0 = expectOk(
      await hello(seat0, {
        role: "seat",
        sessionId: id,
        key: created.seats[0]!.key,
        displayName: "Ana",
      }),
    );
    expect(s0.seatIndex).toBe(0);
    expect(s0.view.seats[0]!.claimed).toBe(true);
    expect(s0.view.seats[0]!.displayName).toBe("Ana");
    expectOk(await hello(seat1, { role: "seat", sessionId: id, key: created.seats[1]!.key }));
    expectOk(await hello(screen, { role: "spectator", sessionId: id, key: created.spectatorKey }));

    // Round 1: both humans seal; the computer sealed at opening; the round closes by itself.
    expectOk(await command(fac, { type: "openRound" }));
    const m0 = expectOk(
      await command(seat0, { type: "sealMove", clientMoveId: "r1-a", effort: 37.25 }),
    );
    expect(m0).toMatchObject({ round: 1, seatIndex: 0, clientMoveId: "r1-a", effort: 37.25 });
    // same clientMoveId again: same ack, nothing new in the log
    const before = (await eventLog(file.server.db, id)).length;
    const again = expectOk(
      await command(seat0, { type: "sealMove", clientMoveId: "r1-a", effort: 37.25 }),
    );
    expect(again).toEqual(m0);
    expect((await eventLog(file.server.db, id)).length).toBe(before);
    // The last seal and the close it causes go to the database as one append (one commit
    // before the reveal instead of two), with the seal right before the round's result.
    const appends = vi.spyOn(file.server.db.events, "append");
    expectOk(await command(seat1, { type: "sealMove", clientMoveId: "r1-b", effort: 12.5 }));
    expect(appends).toHaveBeenCalledTimes(1);
    appends.mockRestore();
    const log1 = await eventLog(file.server.db, id);
    const lastSeal = log1.findLast((e) => e.type === "move-sealed")!;
    expect(log1.find((e) => e.seq === lastSeal.seq + 1)?.type).toBe("round-resolved");
    await eventually(() => expect(roundsOf(lastView(fac))).toHaveLength(1));
    expect(lastView(fac).rounds[0]!.reason).toBe("all-sealed");

    // Round 2: only seat 0 seals; the facilitator closes; seat 1 plays zero (missingMove "zero").
    expectOk(await command(fac, { type: "openRound" }));
    expectOk(await command(seat0, { type: "sealMove", clientMoveId: "r2-a", effort: 20 }));
    expectOk(await command(fac, { type: "closeRound" }));
    await eventually(() => expect(roundsOf(lastView(screen))).toHaveLength(2));
    const r2 = lastView(screen).rounds[1]!;
    expect(r2.reason).toBe("facilitator");
    expect(r2.defaulted).toEqual([false, true, false]);
    expect(r2.efforts[1]).toBe(0);

    // Shock between rounds: a larger prize and a cheaper second rival.
    expect(
      (await command(fac, { type: "applyShock", changes: [{ target: "prize", value: 150 }] })).ok,
    ).toBe(true);
    expectOk(
      await command(fac, {
        type: "applyShock",
        changes: [{ target: "rival", index: 1, field: "cost", value: 1.1 }],
      }),
    );

    // Round 3 on a 30 s clock: seat 1 seals, seat 0 does not; the clock closes it.
    expectOk(await command(fac, { type: "openRound", durationSeconds: 30 }));
    expect(lastView(fac).deadline).toBe(clock.now() + 30_000);
    const r3b = expectOk(
      await command(seat1, { type: "sealMove", clientMoveId: "r3-b", effort: 27.5 }),
    );
    clock.advance(29_000);
    // A repeat of the seal is the barrier: it waits behind anything the clock set off for this
    // session, and its ack comes after any view that pushed.
    expect(
      expectOk(await command(seat1, { type: "sealMove", clientMoveId: "r3-b", effort: 27.5 })),
    ).toEqual(r3b);
    expect(lastView(fac).status).toBe("open");
    // The live state, advanced from the appended events without reading them back, equals a
    // fresh fold of the stored log (what a restart rebuilds).
    const live = await file.server.app.hub.get(id);
    const folded = (await eventLog(file.server.db, id)).reduce(apply, initialState());
    expect(live?.state).toStrictEqual(folded);
    expect(folded.seq).toBeGreaterThan(10);
    clock.advance(1_000);
    await eventually(() => expect(lastView(fac).status).toBe("ended"));
    const final = lastView(fac);
    expect(final.endedReason).toBe("rounds-complete");
    expect(final.rounds.map((r) => r.reason)).toEqual(["all-sealed", "facilitator", "clock"]);
    expect(final.rounds[2]!.scenario.prize).toBe(150);
    expect(final.rounds[2]!.scenario.rivals[1]!.cost).toBe(1.1);

    // Every stored number equals the solver's, recomputed here from the efforts played.
    let running = [0, 0, 0];
    for (const r of final.rounds) {
      const contest = normalize(r.scenario);
      const played = r.seatIndices.map((seat) => r.efforts[seat]!);
      const resp = respond(contest, played);
      const eq = solve(contest).equilibrium;
      const sum = played.reduce((a, b) => a + b, 0);
      r.seatIndices.forEach((seat, k) => {
        // Tullock (1980) ratio form with r = 1 and equal weights: p_i = e_i / sum_j e_j.
        expect(r.shares[seat]).toBeCloseTo(sum > 0 ? played[k]! / sum : 1 / played.length, 12);
        expect(r.payoffs[seat]).toBeCloseTo(resp.payoffs[k]!, 9);
        expect(r.bestResponses[seat]).toBeCloseTo(resp.bestResponses[k]!, 9);
        expect(r.regrets[seat]).toBeCloseTo(resp.regrets[k]!, 9);
        // u_i = v p_i - m_i e_i
        expect(r.payoffs[seat]).toBeCloseTo(
          contest.rivals[k]!.value * r.shares[seat]! - contest.rivals[k]!.cost * played[k]!,
          9,
        );
      });
      expect(r.nashGap).toBeCloseTo(resp.nashGap, 9);
      expect(r.equilibrium.efforts).not.toBeNull();
      r.equilibrium.efforts!.forEach((e, k) => expect(e).toBeCloseTo(eq.efforts![k]!, 9));
      // The computer seat plays the equilibrium effort on the 0.25 grid.
      expect(Math.abs(r.efforts[2]! - eq.efforts![2]!)).toBeLessThanOrEqual(0.125 + 1e-9);
      running = running.map((t, seat) => t + r.payoffs[seat]!);
      running.forEach((t, seat) => expect(r.totals[seat]).toBeCloseTo(t, 9));
    }
    expect(final.rounds[0]!.efforts.slice(0, 2)).toEqual([37.25, 12.5]);
    expect(final.rounds[2]!.efforts.slice(0, 2)).toEqual([0, 27.5]);
    expect(final.rounds[2]!.defaulted).toEqual([true, false, false]);

    // Export: the JSON record is the event log, the rounds are the views' rounds.
    const log = await eventLog(file.server.db, id);
    const exported = (await (
      await getWithKey(`${file.server.url}/api/sessions/${id}/export`, created.facilitatorKey)
    ).json()) as {
      session: { id: string; status: string; rounds: number };
      events: unknown[];
      rounds: unknown[];
      shocks: { afterRound: number; before: { prize: number }; after: { prize: number } }[];
    };
    expect(exported.events).toEqual(JSON.parse(JSON.stringify(log)));
    // both shocks came after round 2, each with the contest before and after it
    expect(exported.shocks.map((s) => s.afterRound)).toEqual([2, 2]);
    expect([exported.shocks[0]!.before.prize, exported.shocks[0]!.after.prize]).toEqual([100, 150]);
    expect(exported.rounds).toEqual(JSON.parse(JSON.stringify(final.rounds)));
    expect(exported.session).toMatchObject({ id, status: "ended", rounds: 3 });
    expect(log.map((e) => e.seq)).toEqual(log.map((_, i) => i + 1));

    const csvRes = await getWithKey(
      `${file.server.url}/api/sessions/${id}/export?format=csv`,
      created.facilitatorKey,
    );
    expect(csvRes.headers.get("content-type")).toMatch(/text\/csv/);
    const lines = (await csvRes.text()).trimEnd().split("\r\n");
    expect(lines[0]).toBe(
      "round,seat,rival,spend,effort,share,payoff,total,bestResponseSpend,bestResponse,regret,equilibriumSpend,equilibriumEffort,defaulted,reason,changesBefore,moveReason,roundNote",
    );
    expect(lines).toHaveLength(1 + 3 * 3);
    const row = lines[1]!.split(",");
    // cost 1: the spend equals the effort
    expect(row.slice(0, 5)).toEqual(["1", "0", "Inkwell Press", "37.25", "37.25"]);
    expect(Number(row[6])).toBeCloseTo(final.rounds[0]!.payoffs[0]!, 9);
    // Foxglove Prints (cost 1.25) sealed effort 12.5: a spend of 15.625
    expect(lines[2]!.split(",").slice(2, 5)).toEqual(["Foxglove Prints", "15.625", "12.5"]);
    expect(lines.filter((l) => l.startsWith("3,"))).toHaveLength(3);
    // the round-3 rows list the shocks applied before it; earlier rows list none
    expect(lines.find((l) => l.startsWith("3,"))).toMatch(
      /,prize 100 -> 150; Foxglove Prints cost 1\.25 -> 1\.1,,$/,
    );
    expect(lines[1]).toMatch(/,,,$/);
  });

  it("a guest claims a free seat with the join code and then plays it with the returned key", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops({ rounds: 1 }));
    const guest = await client();
    const g = expectOk(
      await hello(guest, { role: "guest", joinCode: created.joinCode.toLowerCase() }),
    );
    expect(g.role).toBe("guest");
    expect(g.sessionId).toBeNull();
    const claim = expectOk(
      await command(guest, { type: "claimSeat", seatIndex: 2, displayName: "Bo" }),
    );
    expect(claim).toMatchObject({ sessionId: created.id, seatIndex: 2 });
    const seatKey = (claim as { seatKey: string }).seatKey;
    expect(seatKey).toMatch(/^[A-Za-z0-9_-]{43}$/);
    // the same seat cannot be claimed twice by join code
    const other = await client();
    expectOk(await hello(other, { role: "guest", joinCode: created.joinCode }));
    const twice = await command(other, { type: "claimSeat", seatIndex: 2, displayName: "Cy" });
    expect(twice).toMatchObject({ ok: false, code: "conflict" });
    // the claim key opens the seat
    const seat = await client();
    const s = expectOk(await hello(seat, { role: "seat", sessionId: created.id, key: seatKey }));
    expect(s.seatIndex).toBe(2);
    expect(s.view.seats[2]).toMatchObject({ claimed: true, displayName: "Bo" });
    // guests may not send facilitator commands
    expect(await command(guest, { type: "openRound" })).toMatchObject({
      ok: false,
      code: "forbidden",
    });
  });

  it("the hello ack gives the server's clock, on which the round deadline lies, whatever the client's clock says", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops({ rounds: 1 }));
    const fac = await client();
    expectOk(
      await hello(fac, { role: "facilitator", sessionId: created.id, key: created.facilitatorKey }),
    );
    expectOk(await command(fac, { type: "openRound", durationSeconds: 45 }));
    clock.advance(5_000);
    const screen = await client();
    const ack = expectOk(
      await hello(screen, { role: "spectator", sessionId: created.id, key: created.spectatorKey }),
    );
    // the test's server clock stands months away from this machine's, as a skewed browser's would
    expect(Math.abs(Date.now() - clock.now())).toBeGreaterThan(86_400_000);
    expect(ack.serverNow).toBe(clock.now());
    expect(ack.view.deadline! - ack.serverNow).toBe(40_000);
  });
});

describe("two server processes sharing one database", () => {
  it("the event log's seq check serialises them: a stale server reloads and decides again", async () => {
    const other = createApplication({ db: file.server.db, clock });
    const { port } = await other.listen(0, "127.0.0.1");
    try {
      const created = await createSessionOverHttp(file.server.url, printShops({ rounds: 2 }));
      const id = created.id;
      const creds = { role: "facilitator", sessionId: id, key: created.facilitatorKey };
      // both processes load the session at seq 1 (lobby)
      const here = await client();
      expectOk(await hello(here, creds));
      const there = await client(`http://127.0.0.1:${port}`);
      expectOk(await hello(there, creds));
      // this process appends seq 2; the other still holds seq 1
      expectOk(
        await command(here, { type: "applyShock", changes: [{ target: "prize", value: 250 }] }),
      );
      // the other decides openRound on its stale state, loses the seq check, reloads, decides again
      const opened = expectOk(await command(there, { type: "openRound" }));
      expect(opened).toEqual({ seq: 3 });
      const log = await eventLog(file.server.db, id);
      expect(log.map((e) => [e.seq, e.type])).toEqual([
        [1, "session-created"],
        [2, "shock-applied"],
        [3, "round-opened"],
      ]);
      // the round was decided on the reloaded state: it is played for the shocked prize
      expect(log[2]).toMatchObject({ type: "round-opened", scenario: { prize: 250 } });
    } finally {
      await other.close();
    }
  });
});
