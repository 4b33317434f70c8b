/**
 * The feed several processes share on PostgreSQL (src/feed.ts): every committed append is
 * announced with its session and last seq, messages reach every listener, and a session's
 * lease is held by one connection at a time and freed when that connection closes.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openDatabase, type Database } from "../src/index";
import { backends, TEST_DATABASE_URL } from "./backends";
import { sessionInput } from "./fixtures";

const postgres = backends.find((b) => b.name === "postgresql");

/**
 * What one process hears on the feed. `until(check)` resolves once `check` passes; it is checked
 * again each time this process hears something, so the test waits for the message, not for time
 * (a message that never comes fails the test at its timeout).
 */
function recorder(db: Database) {
  const heard = { committed: [] as string[], signals: [] as unknown[], lost: 0 };
  const waiting = new Set<() => void>();
  const heardSomething = () => {
    for (const retry of [...waiting]) retry();
  };
  db.feed!.listen({
    committed: (id, seq) => {
      heard.committed.push(`${id}:${seq}`);
      heardSomething();
    },
    signal: (m) => {
      heard.signals.push(m);
      heardSomething();
    },
    reconnected: () => undefined,
    leasesLost: () => {
      heard.lost++;
      heardSomething();
    },
  });
  const until = (check: () => void) =>
    new Promise<void>((resolve) => {
      const attempt = () => {
        try {
          check();
        } catch {
          return;
        }
        waiting.delete(attempt);
        resolve();
      };
      waiting.add(attempt);
      attempt();
    });
  return Object.assign(heard, { until });
}

describe.skipIf(!TEST_DATABASE_URL)("the PostgreSQL feed", () => {
  let one: Database;
  let two: Database;
  let dispose: (() => Promise<void>) | undefined;
  let oneClosed = false;

  beforeAll(async () => {
    const fresh = await postgres!.fresh();
    dispose = fresh.dispose;
    one = await openDatabase({ url: fresh.url });
    two = await openDatabase({ url: fresh.url });
  });
  afterAll(async () => {
    if (!oneClosed) await one?.close();
    await two?.close();
    await dispose?.();
  });

  it("announces each committed append (grouped or alone) to every process; a refused one is not announced", async () => {
    const heardTwo = recorder(two);
    const { input } = sessionInput();
    expect((await one.sessions.create(input)).ok).toBe(true);
    const ev = { type: "note", at: 1_700_000_001_000, payload: {} };
    expect(await one.events.append(input.id, 1, [ev, ev])).toEqual({ ok: true, seqs: [2, 3] });
    expect((await one.events.append(input.id, 1, [ev])).ok).toBe(false);
    await heardTwo.until(() => expect(heardTwo.committed).toEqual([`${input.id}:3`]));
    // an append that stores keys goes alone (an interactive transaction): announced too
    const keyed = await one.events.append(input.id, 3, [ev], {
      addKeys: [{ role: "spectator", seatIndex: null, plaintext: "k".repeat(43) }],
    });
    expect(keyed.ok).toBe(true);
    await heardTwo.until(() =>
      expect(heardTwo.committed).toEqual([`${input.id}:3`, `${input.id}:4`]),
    );
  });

  it("carries messages to every process, the sender's included", async () => {
    const heardOne = recorder(one);
    const heardTwo = recorder(two);
    await one.feed!.publish({ kind: "hello", n: 1 });
    await heardTwo.until(() => expect(heardTwo.signals).toEqual([{ kind: "hello", n: 1 }]));
    await heardOne.until(() => expect(heardOne.signals).toEqual([{ kind: "hello", n: 1 }]));
  });

  it("gives a lease to one process at a time, and frees it on release or when its holder closes", async () => {
    expect(await one.feed!.tryLeases(["s-1", "s-2"])).toEqual(["s-1", "s-2"]);
    expect(await two.feed!.tryLeases(["s-1", "s-2", "s-3"])).toEqual(["s-3"]);
    await one.feed!.releaseLease("s-1");
    expect(await two.feed!.tryLeases(["s-1", "s-2"])).toEqual(["s-1"]);
    // the holder goes away (its connection closes): its leases are free at once
    await one.close();
    oneClosed = true;
    expect(await two.feed!.tryLeases(["s-2"])).toEqual(["s-2"]);
  });
});
