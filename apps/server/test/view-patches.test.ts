import { describe, expect, it } from "vitest";
import {
  command,
  createSessionOverHttp,
  eventually,
  expectOk,
  hello,
  serverForFile,
} from "./helpers";
import type { Client } from "./helpers";
import { printShops } from "./fixtures";
import { createManualClock } from "../src/clock";
import { fixedGauge } from "../src/loadGauge";

const file = serverForFile();
const client = file.client;

/** The full view a fresh connection with the same credentials gets now. */
async function freshView(credentials: unknown) {
  const c = await client();
  return expectOk(await hello(c, credentials));
}

describe("pushed view patches", () => {
  it("every connection's patched view equals the full view a fresh hello gets, for every role, after two rounds", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops({ rounds: 2 }));
    const id = created.id;
    const creds: [string, unknown][] = [
      ["facilitator", { role: "facilitator", sessionId: id, key: created.facilitatorKey }],
      ["spectator", { role: "spectator", sessionId: id, key: created.spectatorKey }],
      ...created.seats.map((s, i): [string, unknown] => [
        `seat ${i}`,
        { role: "seat", sessionId: id, key: s.key },
      ]),
    ];
    const clients: Client[] = [];
    for (const [, c] of creds) {
      const socket = await client();
      expectOk(await hello(socket, c));
      clients.push(socket);
    }
    const [fac, , ...seats] = clients;
    let lastSeq = 0;
    for (let round = 1; round <= 2; round++) {
      lastSeq = expectOk(await command(fac!, { type: "openRound" })).seq;
      for (const [i, s] of seats.entries()) {
        if (round === 2 && i === seats.length - 1) continue; // round 2 is closed by hand
        lastSeq = expectOk(
          await command(s, { type: "sealMove", clientMoveId: `r${round}s${i}`, effort: 5 + i }),
        ).seq;
      }
      if (round === 2) lastSeq = expectOk(await command(fac!, { type: "closeRound" })).seq;
    }

    for (const [k, [who, c]] of creds.entries()) {
      const socket = clients[k]!;
      await eventually(() => expect(socket.tracker.seq, who).toBeGreaterThanOrEqual(lastSeq));
      const fresh = await freshView(c);
      expect(socket.tracker.seq, who).toBe(fresh.seq);
      expect(socket.tracker.view, who).toEqual(fresh.view);
      expect(socket.patchGaps, `${who}: patches that did not fit`).toBe(0);
      const patches = socket.received.filter((r) => r.startsWith('["viewPatch"'));
      // at least the two openings and the two results; every push after the hello is a patch
      expect(patches.length, who).toBeGreaterThanOrEqual(4);
      const fulls = socket.received.filter((r) => r.startsWith('["view"'));
      expect(fulls, `${who}: no full view was needed`).toEqual([]);
      // a patch is a small fraction of a full view
      const mean = patches.reduce((n, p) => n + p.length, 0) / patches.length;
      expect(mean, who).toBeLessThan(JSON.stringify(fresh.view).length / 2);
    }
  });
});

describe("progress pushes", () => {
  // A wide window, so that the machine's speed cannot split the seals below into two pushes.
  const wide = serverForFile({ limits: { progressPushMs: 1_500 } });

  it("a sealer's own view moves at once; the others get the seals of one window as one patch", async () => {
    const created = await createSessionOverHttp(wide.server.url, printShops({ rounds: 2 }));
    const id = created.id;
    const fac = await wide.client();
    expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
    const seats: Client[] = [];
    for (const s of created.seats.slice(0, 2)) {
      const socket = await wide.client();
      expectOk(await hello(socket, { role: "seat", sessionId: id, key: s.key }));
      seats.push(socket);
    }
    const opened = expectOk(await command(fac, { type: "openRound" })).seq;
    const heldBefore = fac.received.length;
    const acks: number[] = [];
    for (const [i, s] of seats.entries()) {
      const ack = expectOk(
        await command(s, { type: "sealMove", clientMoveId: `p${i}`, effort: 3 + i }),
      );
      // the sealer's push was sent before its ack
      expect(s.tracker.seq).toBe(ack.seq);
      acks.push(ack.seq);
    }
    expect(fac.tracker.seq).toBe(opened);
    await eventually(() => expect(fac.tracker.seq).toBe(acks.at(-1)));
    const pushes = fac.received.slice(heldBefore).filter((r) => r.startsWith('["viewPatch"'));
    expect(pushes).toHaveLength(1);
    expect(fac.tracker.view!.seats.slice(0, 2).map((s) => s.sealed)).toEqual([true, true]);
    // a commit that is more than seals (here the close) reaches everyone at once
    const closed = expectOk(await command(fac, { type: "closeRound" })).seq;
    for (const s of seats) await eventually(() => expect(s.tracker.seq).toBe(closed), 500);
    expect(seats[0]!.tracker.view!.rounds).toHaveLength(1);
  });
});

describe("progress pushes on a busy server", () => {
  // The gauge reads a full event loop, so the window is the busy one (1.2 s), not 50 ms; the
  // window runs on a test clock, so the test moves time by hand instead of waiting for it.
  const clock = createManualClock();
  const busy = serverForFile({
    limits: { progressPushMs: 50, progressPushBusyMs: 1_200 },
    load: fixedGauge(1),
    clock,
  });

  it("other seats' progress waits for the busy window; the sealer's ack and a result do not", async () => {
    const created = await createSessionOverHttp(busy.server.url, printShops({ rounds: 2 }));
    const fac = await busy.client();
    expectOk(
      await hello(fac, { role: "facilitator", sessionId: created.id, key: created.facilitatorKey }),
    );
    const seat = await busy.client();
    expectOk(
      await hello(seat, { role: "seat", sessionId: created.id, key: created.seats[0]!.key }),
    );
    const opened = expectOk(await command(fac, { type: "openRound" })).seq;
    await eventually(() => expect(seat.tracker.seq).toBe(opened));
    const ack = expectOk(await command(seat, { type: "sealMove", clientMoveId: "b0", effort: 4 }));
    expect(seat.tracker.seq).toBe(ack.seq);
    // Timers never fire early: well past the quiet window, 1 ms short of the busy one, the
    // facilitator still holds the opening. A refused command is the barrier: its ack comes
    // on the same socket after anything pushed to it before.
    clock.advance(1_199);
    const refused = await command(fac, { type: "openRound" });
    expect(refused).toMatchObject({ ok: false, code: "wrong-state" });
    expect(fac.tracker.seq).toBe(opened);
    clock.advance(1);
    await eventually(() => expect(fac.tracker.seq).toBe(ack.seq));
    // a close goes out at once, busy or not
    const seal2 = expectOk(
      await command(seat, { type: "sealMove", clientMoveId: "b1", effort: 5 }),
    );
    const closed = expectOk(await command(fac, { type: "closeRound" })).seq;
    expect(closed).toBeGreaterThan(seal2.seq);
    await eventually(() => expect(fac.tracker.seq).toBe(closed), 500);
  });
});
