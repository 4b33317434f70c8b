/**
 * Two server processes' worth of applications on one PostgreSQL (in this test process, each
 * with its own database pool and feed connection, one manual clock): seats of one session on
 * both, a round clock and a computer seat. Every socket learns of every commit, whichever
 * process made it; the clock fires in one process only (the lease holder); when that one
 * goes, the other takes the clock over. Sealed moves still reach nobody else (leak check with
 * a positive control, as in leak.test.ts).
 */
import { describe, expect, it } from "vitest";
import { createManualClock } from "../src/clock";
import { LEASE_RETRY_MS } from "../src/live/duties";
import {
  command,
  createSessionOverHttp,
  eventLog,
  eventually,
  expectOk,
  hello,
  lastView,
} from "./helpers";
import { printShops } from "./fixtures";
import { serversOnOnePostgres, TEST_DATABASE_URL } from "./pgDatabase";

// Distinctive efforts (on the 0.25 grid), matched as whole JSON numbers.
const SECRET_A = 37.25;
const FIXED = 13.25;
const numberRe = (n: number) => new RegExp(`(?<![\\d.])${String(n).replace(".", "\\.")}(?![\\d])`);

describe.skipIf(!TEST_DATABASE_URL)("two processes on one PostgreSQL", () => {
  const clock = createManualClock();
  // Seals reach the other sockets at once (no progress window on the manual clock).
  const { server, client } = serversOnOnePostgres({ clock, limits: { progressPushMs: 0 } });

  it("every seat sees every reveal; the computer moves once a round; the clock closes once; the other process takes the clock over", async () => {
    const a = await server();
    const b = await server();
    const created = await createSessionOverHttp(
      a.url,
      printShops({
        rounds: 3,
        clockSeconds: 30,
        computer: { "Cobble Copy": { kind: "fixed", effort: FIXED } },
      }),
    );
    const id = created.id;
    const fac = await client(a);
    const seat0 = await client(a);
    const seat1 = await client(b);
    const screenB = await client(b);
    expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
    expectOk(await hello(seat0, { role: "seat", sessionId: id, key: created.seats[0]!.key }));
    expectOk(await hello(seat1, { role: "seat", sessionId: id, key: created.seats[1]!.key }));
    expectOk(await hello(screenB, { role: "spectator", sessionId: id, key: created.spectatorKey }));

    // exactly one process holds the session's clock
    await eventually(() => expect([a, b].filter((s) => s.app.hub.owns(id))).toHaveLength(1));
    const owner = a.app.hub.owns(id) ? a : b;
    const other = owner === a ? b : a;

    // Round 1: both seats seal, one on each process; the last seal closes it.
    expectOk(await command(fac, { type: "openRound" }));
    await eventually(() => expect(lastView(screenB).status).toBe("open"));
    expectOk(await command(seat0, { type: "sealMove", clientMoveId: "r1-a", effort: SECRET_A }));
    // seat 1 (other process) hears that seat 0 sealed, but not what
    await eventually(() => expect(lastView(seat1).seats[0]!.sealed).toBe(true));
    for (const [c, who] of [
      [seat1, "seat 1 (process B)"],
      [screenB, "screen (process B)"],
    ] as const) {
      expect(numberRe(SECRET_A).test(c.received.join("\n")), `${who} saw seat 0's move`).toBe(
        false,
      );
      expect(numberRe(FIXED).test(c.received.join("\n")), `${who} saw the computer's move`).toBe(
        false,
      );
    }
    // positive control: the sealer's own socket carries it
    expect(numberRe(SECRET_A).test(seat0.received.join("\n"))).toBe(true);
    expectOk(await command(seat1, { type: "sealMove", clientMoveId: "r1-b", effort: 20 }));
    for (const c of [fac, seat0, seat1, screenB]) {
      await eventually(() => expect(lastView(c).rounds).toHaveLength(1));
    }
    // revealed: now the other process's sockets see it
    expect(numberRe(SECRET_A).test(screenB.received.join("\n"))).toBe(true);

    // Round 2: on a 30 s clock, only seat 1 seals; the clock closes it, once.
    expectOk(await command(fac, { type: "openRound" }));
    await eventually(() => expect(lastView(seat1).status).toBe("open"));
    expectOk(await command(seat1, { type: "sealMove", clientMoveId: "r2-b", effort: 22 }));
    await eventually(() => expect(lastView(fac).seats[1]!.sealed).toBe(true));
    clock.advance(30_000);
    for (const c of [fac, seat0, seat1, screenB]) {
      await eventually(() => expect(lastView(c).rounds).toHaveLength(2));
    }

    // Round 3: the owner goes away mid-round; the other process takes the clock over.
    const facOnOther = other === a ? fac : await client(other);
    if (facOnOther !== fac) {
      expectOk(
        await hello(facOnOther, {
          role: "facilitator",
          sessionId: id,
          key: created.facilitatorKey,
        }),
      );
    }
    expectOk(await command(facOnOther, { type: "openRound" }));
    const watcher = other === b ? screenB : facOnOther;
    await eventually(() => expect(lastView(watcher).status).toBe("open"));
    await owner.stop();
    expect(other.app.hub.owns(id)).toBe(false);
    clock.advance(LEASE_RETRY_MS);
    await eventually(() => expect(other.app.hub.owns(id)).toBe(true));
    // A seal on the new owner is the barrier: it queues behind the takeover (catch up, arm
    // the clock), so the clock is armed before time moves on.
    const seatOnOther = other === a ? seat0 : seat1;
    expectOk(await command(seatOnOther, { type: "sealMove", clientMoveId: "r3", effort: 9 }));
    clock.advance(30_000);
    await eventually(() => expect(lastView(watcher).status).toBe("ended"));

    const log = await eventLog(other.db, id);
    const count = (type: string) => log.filter((e) => e.type === type).length;
    expect(count("round-opened")).toBe(3);
    expect(count("round-resolved")).toBe(3);
    expect(lastView(watcher).rounds.map((r) => r.reason)).toEqual(["all-sealed", "clock", "clock"]);
    // the computer seat sealed exactly once a round
    const computerSeals = log.filter((e) => e.type === "move-sealed" && e.seatIndex === 2);
    expect(computerSeals.map((e) => (e.type === "move-sealed" ? e.round : 0))).toEqual([1, 2, 3]);
    // seqs are 1..n without gaps or repeats
    expect(log.map((e) => e.seq)).toEqual(log.map((_, i) => i + 1));
  });
});
