import { describe, expect, it, vi } from "vitest";
import {
  command,
  createSessionOverHttp,
  eventLog,
  eventually,
  expectOk,
  hello,
  serverForFile,
} from "./helpers";
import type { Client } from "./helpers";
import { printShops } from "./fixtures";

const file = serverForFile();

/** A session of `rounds` rounds with its facilitator and every seat connected and greeted. */
async function seatedSession(rounds: number) {
  const created = await createSessionOverHttp(file.server.url, printShops({ rounds }));
  const id = created.id;
  const fac = await file.client();
  expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
  const seats = await Promise.all(created.seats.map(() => file.client()));
  for (const [i, s] of seats.entries()) {
    expectOk(await hello(s, { role: "seat", sessionId: id, key: created.seats[i]!.key }));
  }
  return { id, fac, seats };
}

describe("commands of one session that arrive together", () => {
  it("share one append, and each gets the ack it would have got alone", async () => {
    const { id, fac, seats } = await seatedSession(2);
    expect(seats.length).toBeGreaterThanOrEqual(3);
    const [s0, s1, s2] = seats as [Client, Client, Client];
    expectOk(await command(fac, { type: "openRound" }));
    const before = (await eventLog(file.server.db, id)).length;

    // Seat 0's append is held until the commands behind it have reached the session's inbox,
    // so they arrive while it is in flight and wait for the session's next turn together.
    const append = file.server.db.events.append.bind(file.server.db.events);
    const appends = vi.spyOn(file.server.db.events, "append");
    const executes = vi.spyOn(file.server.app.hub, "execute");
    let appendStarted!: () => void;
    const started = new Promise<void>((r) => (appendStarted = r));
    let releaseAppend!: () => void;
    const released = new Promise<void>((r) => (releaseAppend = r));
    appends.mockImplementationOnce(async (...args) => {
      appendStarted();
      await released;
      return append(...args);
    });
    const first = command(s0, { type: "sealMove", clientMoveId: "m0", effort: 12 });
    await started;
    // (in this order: after the last seal the round is closed and a repeat would be refused)
    const rest = Promise.all([
      command(s1, { type: "sealMove", clientMoveId: "m1-bad", effort: 12, round: 9 }),
      command(s0, { type: "sealMove", clientMoveId: "m0", effort: 12 }),
      command(s1, { type: "sealMove", clientMoveId: "m1", effort: 7.5 }),
      command(s2, { type: "sealMove", clientMoveId: "m2", effort: 3 }),
    ]);
    // seat 0's seal and the four behind it have all been handed to the hub
    await eventually(() => expect(executes).toHaveBeenCalledTimes(5));
    executes.mockRestore();
    releaseAppend();
    const [bad, again, a1, a2] = await rest;
    const a0 = expectOk(await first);
    const calls = appends.mock.calls.map((c) => c[2].map((e) => e.type));
    appends.mockRestore();

    // seat 0 alone, then everything that waited behind it in one append
    expect(calls).toEqual([["move-sealed"], ["move-sealed", "move-sealed", "round-resolved"]]);
    // a refused command in the batch is refused alone
    expect(bad).toMatchObject({ ok: false, code: "wrong-state", path: "round" });
    const ack1 = expectOk(a1);
    const ack2 = expectOk(a2);
    expect(ack1).toMatchObject({ round: 1, seatIndex: 1, clientMoveId: "m1", effort: 7.5 });
    expect(ack2).toMatchObject({ round: 1, seatIndex: 2, clientMoveId: "m2", effort: 3 });
    // the repeat of m0 is the same move (R13) with the same ack
    expect(expectOk(again)).toEqual(a0);
    // the log holds each move once, with the seq its ack names, in arrival order
    const log = (await eventLog(file.server.db, id)).slice(before);
    expect(log.map((e) => [e.type, e.seq])).toEqual([
      ["move-sealed", a0.seq],
      ["move-sealed", ack1.seq],
      ["move-sealed", ack2.seq],
      ["round-resolved", ack2.seq + 1],
    ]);
    // every connection got the result in one push after the batch
    for (const s of seats) {
      await eventually(() => expect(s.tracker.view?.rounds).toHaveLength(1));
    }
  });

  it("the seal that ends the session is acked from its own commit, without reading the log", async () => {
    const { id, fac, seats } = await seatedSession(1);
    expectOk(await command(fac, { type: "openRound" }));
    const [last, ...others] = seats as [Client, ...Client[]];
    for (const [i, s] of others.entries()) {
      expectOk(await command(s, { type: "sealMove", clientMoveId: `e${i}`, effort: 5 }));
    }
    // The hub forgets a session once it has ended; a lookup for the ack would load it again.
    const reads = vi.spyOn(file.server.db.events, "list");
    const ack = expectOk(await command(last, { type: "sealMove", clientMoveId: "end", effort: 4 }));
    const readsDuringAck = reads.mock.calls.length;
    reads.mockRestore();
    expect(readsDuringAck).toBe(0);
    const log = await eventLog(file.server.db, id);
    const sealed = log.find((e) => e.type === "move-sealed" && e.clientMoveId === "end");
    expect(ack).toMatchObject({ seq: sealed?.seq, seatIndex: 0, clientMoveId: "end", effort: 4 });
    expect(log.at(-1)?.type).toBe("session-ended");
  });
});
