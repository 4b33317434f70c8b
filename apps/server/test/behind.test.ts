/**
 * A process a moment behind. On one PostgreSQL, process B holds a seat's socket but has not
 * yet heard (its feed is held back here) that process A opened the round. The seat's seal
 * reaches B, whose folded state still says no round is open; B reads the log before it
 * refuses, finds the opening, and stores the seal. A refusal never comes from a state older
 * than the log.
 */
import type { ChangeFeed, Database, FeedHandlers } from "@contend/db";
import { describe, expect, it } from "vitest";
import { createManualClock } from "../src/clock";
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

/** A database whose feed can be held back: while held, notices of commits wait. */
function withHeldFeed(db: Database) {
  let held = false;
  let handlers: FeedHandlers | null = null;
  const waiting: Array<[string, number]> = [];
  const feed = db.feed!;
  const heldFeed: ChangeFeed = {
    ...feed,
    listen(h) {
      handlers = h;
      feed.listen({
        ...h,
        committed(sessionId, lastSeq) {
          if (held) waiting.push([sessionId, lastSeq]);
          else h.committed(sessionId, lastSeq);
        },
      });
    },
  };
  return {
    db: { ...db, feed: heldFeed } as Database,
    hold() {
      held = true;
    },
    release() {
      held = false;
      for (const [id, seq] of waiting.splice(0)) handlers?.committed(id, seq);
    },
    get waiting() {
      return waiting.length;
    },
  };
}

describe.skipIf(!TEST_DATABASE_URL)("a process that has not yet heard of a commit", () => {
  const clock = createManualClock();
  const { server, client } = serversOnOnePostgres({ clock, limits: { progressPushMs: 0 } });

  it("reads the log before refusing a seal, and stores it once", async () => {
    const a = await server();
    let held: ReturnType<typeof withHeldFeed> | null = null;
    const b = await server({
      wrapDatabase: (db) => (held = withHeldFeed(db)).db,
    });
    const created = await createSessionOverHttp(a.url, printShops({ rounds: 2 }));
    const id = created.id;
    const fac = await client(a);
    expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
    const seat = await client(b);
    const greeted = expectOk(
      await hello(seat, { role: "seat", sessionId: id, key: created.seats[0]!.key }),
    );
    expect(greeted.view.status).toBe("lobby");

    held!.hold();
    expectOk(await command(fac, { type: "openRound" }));
    // A committed the opening; B has not heard of it (its notice waits), so B's folded state
    // is older than the log.
    await eventually(() => expect(held!.waiting).toBeGreaterThan(0));
    expect(seat.views).toHaveLength(0);

    const ack = await command(seat, { type: "sealMove", clientMoveId: "late-news", effort: 12 });
    const sealed = expectOk(ack);
    held!.release();

    const log = await eventLog(a.db, id);
    const seals = log.filter((e) => e.type === "move-sealed");
    expect(seals).toHaveLength(1);
    expect(seals[0]).toMatchObject({ seq: sealed.seq, seatIndex: 0, clientMoveId: "late-news" });
    expect(log.map((e) => e.seq)).toEqual(log.map((_, i) => i + 1));
    // B's seat saw the opening (read on the refusal path) and its own seal
    await eventually(() => expect(lastView(seat).status).toBe("open"));
  });
});
