/**
 * Two server processes' worth of applications on one PostgreSQL sealing into one session: a
 * batch that loses the seq check to the other writer reads what it committed and decides
 * again, several times in a row if it must. Every acked seal is in the log exactly once.
 */
import { describe, expect, it, vi } from "vitest";
import { createManualClock } from "../src/clock";
import {
  command,
  createSessionOverHttp,
  eventLog,
  eventually,
  expectOk,
  FLOOD_LIMITS,
  hello,
  lastView,
} from "./helpers";
import type { Client, TestServer } from "./helpers";
import { printShops } from "./fixtures";
import { serversOnOnePostgres, TEST_DATABASE_URL } from "./pgDatabase";

/** Ten invented rivals: enough seats that seven can seal without closing the round. */
function tenShops(rounds: number) {
  const base = printShops({ rounds });
  const rivals = Array.from({ length: 10 }, (_, i) => ({
    name: `Print shop ${String.fromCharCode(65 + i)}`,
    cost: 1 + i / 10,
  }));
  return { ...base, title: "Ten print shops bid for the town's poster contract", rivals };
}

describe.skipIf(!TEST_DATABASE_URL)("seq conflicts between two processes", () => {
  const clock = createManualClock();
  const { server, client } = serversOnOnePostgres({
    clock,
    limits: { progressPushMs: 0, ...FLOOD_LIMITS },
  });

  /** A session of ten seats; seat i connects to `on(i)`; the facilitator to the first. */
  async function seated(processes: TestServer[], rounds: number, on: (i: number) => number) {
    const created = await createSessionOverHttp(processes[0]!.url, tenShops(rounds));
    const id = created.id;
    const fac = await client(processes[0]!);
    expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
    const seats: Client[] = [];
    for (const [i, seat] of created.seats.entries()) {
      const c = await client(processes[on(i)]!);
      expectOk(await hello(c, { role: "seat", sessionId: id, key: seat.key }));
      seats.push(c);
    }
    return { id, fac, seats };
  }

  /**
   * The facilitator opens a round once its own view shows the previous one resolved (as the
   * console offers the button: the last seal may have committed on the other process, which
   * this one hears of a moment later); every seat's process has heard the opening before
   * anyone seals.
   */
  async function openRound(fac: Client, seats: Client[], round: number) {
    await eventually(() => {
      expect(lastView(fac).status).not.toBe("open");
      expect(lastView(fac).rounds).toHaveLength(round - 1);
    });
    expectOk(await command(fac, { type: "openRound" }));
    for (const s of seats) {
      await eventually(() => {
        expect(lastView(s).status).toBe("open");
        expect(lastView(s).rounds).toHaveLength(round - 1);
      });
    }
  }

  it("a seal beaten to the log seven times in a row is decided again and stored once", async () => {
    const a = await server();
    const b = await server();
    // seat 0 on process A, the others on B
    const { id, fac, seats } = await seated([a, b], 1, (i) => (i === 0 ? 0 : 1));
    await openRound(fac, seats, 1);

    // Before each of A's first seven appends, a seat on B seals (and commits) first, so A's
    // append names a seq that is already taken and must read the log and decide again.
    const append = a.db.events.append.bind(a.db.events);
    const appends = vi.spyOn(a.db.events, "append");
    let interposed = 0;
    appends.mockImplementation(async (...args) => {
      if (interposed < 7) {
        interposed++;
        const seat = seats[interposed]!;
        expectOk(
          await command(seat, { type: "sealMove", clientMoveId: `b${interposed}`, effort: 5 }),
        );
      }
      return append(...args);
    });
    const ack = await command(seats[0]!, { type: "sealMove", clientMoveId: "a0", effort: 12 });
    const attempts = appends.mock.calls.length;
    appends.mockRestore();

    const sealed = expectOk(ack);
    expect(attempts).toBe(8);
    const log = await eventLog(a.db, id);
    const seals = log.filter((e) => e.type === "move-sealed");
    expect(seals.map((e) => (e.type === "move-sealed" ? e.clientMoveId : "")).sort()).toEqual(
      ["a0", "b1", "b2", "b3", "b4", "b5", "b6", "b7"].sort(),
    );
    // A's seal is the last one, under the seq its ack names
    expect(seals.at(-1)).toMatchObject({ seq: sealed.seq, seatIndex: 0, clientMoveId: "a0" });
    expect(log.map((e) => e.seq)).toEqual(log.map((_, i) => i + 1));
  });

  it("seats on both processes sealing at once: every acked seal is in the log exactly once", async () => {
    const a = await server();
    const b = await server();
    const rounds = 3;
    // even seats on A, odd seats on B
    const { id, fac, seats } = await seated([a, b], rounds, (i) => i % 2);
    for (let round = 1; round <= rounds; round++) {
      await openRound(fac, seats, round);
      const acks = await Promise.all(
        seats.map((s, i) =>
          command(s, { type: "sealMove", clientMoveId: `r${round}-s${i}`, effort: 4 + i }),
        ),
      );
      for (const [i, ack] of acks.entries()) {
        expect(ack, `seat ${i} in round ${round}`).toMatchObject({ ok: true });
      }
    }

    const log = await eventLog(a.db, id);
    const seals = log.flatMap((e) => (e.type === "move-sealed" ? [e.clientMoveId] : []));
    const expected = Array.from({ length: rounds }, (_, r) =>
      seats.map((_, i) => `r${r + 1}-s${i}`),
    ).flat();
    expect([...seals].sort()).toEqual([...expected].sort());
    expect(log.filter((e) => e.type === "round-resolved")).toHaveLength(rounds);
    expect(log.map((e) => e.seq)).toEqual(log.map((_, i) => i + 1));
  });
});
