import { afterAll, describe, expect, it } from "vitest";
import { createManualClock } from "../src/clock";
import {
  command,
  connect,
  createSessionOverHttp,
  eventLog,
  eventually,
  expectOk,
  freshDataDir,
  hello,
  lastView,
  removeDataDir,
  startServer,
} from "./helpers";
import type { Client } from "./helpers";
import { printShops } from "./fixtures";

const dataDir = freshDataDir();
const clients: Client[] = [];
afterAll(() => {
  for (const c of clients) c.disconnect();
  removeDataDir(dataDir);
});

async function client(url: string) {
  const c = await connect(url);
  clients.push(c);
  return c;
}

describe("restart", () => {
  it("a new server on the same data keeps every acked move and the round resolves; an overdue clock closes at start", async () => {
    const clock = createManualClock();
    const first = await startServer({ dataDir, clock });
    const a = await createSessionOverHttp(first.url, printShops({ rounds: 2 }));
    const b = await createSessionOverHttp(first.url, printShops({ rounds: 2 }));

    const fac = await client(first.url);
    expectOk(await hello(fac, { role: "facilitator", sessionId: a.id, key: a.facilitatorKey }));
    expectOk(await command(fac, { type: "openRound" }));
    const seat0 = await client(first.url);
    const seat1 = await client(first.url);
    expectOk(await hello(seat0, { role: "seat", sessionId: a.id, key: a.seats[0]!.key }));
    expectOk(await hello(seat1, { role: "seat", sessionId: a.id, key: a.seats[1]!.key }));
    const ack0 = expectOk(
      await command(seat0, { type: "sealMove", clientMoveId: "m0", effort: 37.25 }),
    );
    expectOk(await command(seat1, { type: "sealMove", clientMoveId: "m1", effort: 12.5 }));
    // seat 1 changes its mind; the later move is the one that counts
    expectOk(await command(seat1, { type: "sealMove", clientMoveId: "m1b", effort: 14.75 }));

    // Session b: a round on a 60 s clock that runs out while the server is down.
    const facB = await client(first.url);
    expectOk(await hello(facB, { role: "facilitator", sessionId: b.id, key: b.facilitatorKey }));
    expectOk(await command(facB, { type: "openRound", durationSeconds: 60 }));
    const logA = await eventLog(first.db, a.id);
    const logB = await eventLog(first.db, b.id);
    await first.stop();

    clock.advance(120_000);
    const second = await startServer({ dataDir, clock });
    try {
      expect(await eventLog(second.db, a.id)).toEqual(logA);
      // b's round was overdue: restore() closed it for the clock at once
      const endedB = await eventually(async () => {
        const log = await eventLog(second.db, b.id);
        expect(log.length).toBeGreaterThan(logB.length);
        return log;
      });
      const resolvedB = endedB.find((e) => e.type === "round-resolved");
      expect(resolvedB).toMatchObject({ round: 1, reason: "clock" });

      // The seats reconnect, with the last seq they saw, and get their own sealed move back.
      const again0 = await client(second.url);
      const h0 = expectOk(
        await hello(again0, { role: "seat", sessionId: a.id, key: a.seats[0]!.key }, ack0.seq),
      );
      expect(h0.view.status).toBe("open");
      expect(h0.view.you).toEqual({
        seatIndex: 0,
        sealedEffort: 37.25,
        sealedSpend: 37.25, // cost 1
        clientMoveId: "m0",
      });
      expect(h0.view.seats.map((s) => s.sealed)).toEqual([true, true, false]);
      const again1 = await client(second.url);
      const h1 = expectOk(
        await hello(again1, { role: "seat", sessionId: a.id, key: a.seats[1]!.key }),
      );
      expect(h1.view.you?.sealedEffort).toBe(14.75);
      // the same clientMoveId after the restart is still recognised as the same move
      const repeat = expectOk(
        await command(again0, { type: "sealMove", clientMoveId: "m0", effort: 37.25 }),
      );
      expect(repeat).toEqual(ack0);

      // the third seat arrives and seals: the round resolves with every acked move
      const seat2 = await client(second.url);
      expectOk(await hello(seat2, { role: "seat", sessionId: a.id, key: a.seats[2]!.key }));
      expectOk(await command(seat2, { type: "sealMove", clientMoveId: "m2", effort: 21 }));
      await eventually(() => expect(lastView(again1).rounds).toHaveLength(1));
      const r1 = lastView(again1).rounds[0]!;
      expect(r1.efforts).toEqual([37.25, 14.75, 21]);
      expect(r1.defaulted).toEqual([false, false, false]);
      expect(r1.reason).toBe("all-sealed");
    } finally {
      await second.stop();
    }
  });
});
