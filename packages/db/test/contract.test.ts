import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hashKey, newKey, openDatabase, readMigrations, type Database } from "../src/index";
import { backends, TEST_DATABASE_URL } from "./backends";
import {
  claimed,
  label,
  note,
  opened,
  resolved,
  sealed,
  seatsOf,
  sessionInput,
  takeSeat,
} from "./fixtures";

describe.each(backends)("repositories on $name", (backend) => {
  let db: Database;
  let dispose: () => Promise<void>;

  beforeAll(async () => {
    const fresh = await backend.fresh();
    dispose = fresh.dispose;
    db = await openDatabase({ url: fresh.url });
  });

  afterAll(async () => {
    await db?.close();
    await dispose?.();
  });

  it("openDatabase() on an empty database applies every migration, in order", () => {
    expect(db.kind).toBe(backend.name === "postgresql" ? "postgres" : "pglite");
    expect(db.migrationsApplied).toEqual([
      "20261202033000_init",
      "20261204212024_drop_unused_scenario_table",
      "20261205000000_notify_committed_events",
      "20261205003000_session_library",
      "20261205010000_rate_limit",
    ]);
  });

  it("sessions.create(input) writes session, seats, keys and event seq 1 together", async () => {
    const { input, facilitatorKey } = sessionInput();
    const created = await db.sessions.create(input);
    expect(created.ok).toBe(true);
    if (!created.ok) return;
    expect(created.session).toMatchObject({
      id: input.id,
      joinCode: input.joinCode,
      title: "Kiosk lease",
      status: "lobby",
      lastSeq: 1,
      scenario: input.scenario,
    });
    expect(created.session.seats).toEqual([
      { index: 0, name: "North Bakery", kind: "human", displayName: null, claimedAt: null },
      { index: 1, name: "Harbour Bakery", kind: "computer", displayName: null, claimedAt: null },
    ]);
    const log = await db.events.list(input.id);
    expect(log).toHaveLength(1);
    expect(log[0]).toMatchObject({
      seq: 1,
      type: "session-created",
      at: 1_700_000_000_000,
      seed: 42,
    });
    expect(await db.keys.resolve(input.id, facilitatorKey)).toEqual({
      role: "facilitator",
      seatIndex: null,
    });
    expect((await db.sessions.byJoinCode(input.joinCode))?.id).toBe(input.id);
    expect((await db.sessions.get(input.id))?.seats).toHaveLength(2);
  });

  it("sessions.create(input) with a taken joinCode returns conflict and writes nothing", async () => {
    const first = sessionInput();
    expect((await db.sessions.create(first.input)).ok).toBe(true);
    const clash = sessionInput({ joinCode: first.input.joinCode });
    expect(await db.sessions.create(clash.input)).toEqual({
      ok: false,
      code: "conflict",
      field: "joinCode",
    });
    expect(await db.sessions.get(clash.input.id)).toBeNull();
    expect(await db.keys.resolve(clash.input.id, clash.facilitatorKey)).toBeNull();
    expect(await db.events.list(clash.input.id)).toEqual([]);
  });

  it("sessions.create(input) with a taken id returns conflict on id", async () => {
    const first = sessionInput();
    expect((await db.sessions.create(first.input)).ok).toBe(true);
    const clash = sessionInput({ id: first.input.id });
    expect(await db.sessions.create(clash.input)).toEqual({
      ok: false,
      code: "conflict",
      field: "id",
    });
    expect(await db.sessions.byJoinCode(clash.input.joinCode)).toBeNull();
  });

  it("sessions.create(input) failing on its keys rolls back the session row too", async () => {
    const first = sessionInput();
    await db.sessions.create(first.input);
    // Reusing another session's key clashes on AccessKey.hash, the third write of the batch.
    const clash = sessionInput();
    clash.input.keys[1] = { role: "seat", seatIndex: 0, plaintext: first.facilitatorKey };
    await expect(db.sessions.create(clash.input)).rejects.toThrow();
    expect(await db.sessions.get(clash.input.id)).toBeNull();
    expect(await seatsOf(db, clash.input.id)).toEqual([]);
    expect(await db.keys.resolve(clash.input.id, clash.facilitatorKey)).toBeNull();
  });

  it("event payloads keep every double bit for bit (JSONB numeric holds the shortest round-trip digits)", async () => {
    const { input } = sessionInput();
    await db.sessions.create(input);
    const values = [
      0.1 + 0.2,
      1 / 3,
      Math.PI,
      5e-324,
      Number.MAX_VALUE,
      -1.5e-10,
      123456789.12345678,
      2 ** 53 + 2,
      ...Array.from({ length: 20 }, (_, i) => Math.sin(i + 1) * 10 ** (i - 10)),
    ];
    await db.events.append(input.id, 1, [resolved(1, values)]);
    const [, stored] = await db.events.list(input.id);
    if (stored?.type !== "round-resolved") throw new Error("expected round-resolved");
    const shares = stored.shares;
    expect(shares).toHaveLength(values.length);
    shares.forEach((v, i) => expect(Object.is(v, values[i])).toBe(true));
  });

  it("session scenarios keep 17-digit doubles too; NaN is refused", async () => {
    const prize = 0.1 + 0.2; // 0.30000000000000004
    const { input } = sessionInput({ scenario: { prize } });
    await db.sessions.create(input);
    expect((await db.sessions.get(input.id))?.scenario).toEqual({ prize });
    expect(
      Object.is(((await db.sessions.get(input.id))?.scenario as { prize: number }).prize, prize),
    ).toBe(true);

    await expect(db.events.append(input.id, 1, [sealed(1, 0, NaN)])).rejects.toThrow(
      /cannot store NaN/,
    );
    expect((await db.sessions.get(input.id))?.lastSeq).toBe(1);
  });

  it("sessions.get/byJoinCode of unknown values return null", async () => {
    expect(await db.sessions.get("no-such-session")).toBeNull();
    expect(await db.sessions.byJoinCode("ZZZZZZ9")).toBeNull();
  });

  it("events.append(id, lastSeq, events) assigns consecutive seqs and list(afterSeq) pages", async () => {
    const { input } = sessionInput();
    await db.sessions.create(input);
    const appended = await db.events.append(input.id, 1, [
      opened(1_700_000_001_000),
      sealed(1_700_000_001_001, 1, 12.5),
    ]);
    expect(appended).toEqual({ ok: true, seqs: [2, 3] });
    const third = await db.events.append(input.id, 3, [resolved(1_700_000_002_000)]);
    expect(third).toEqual({ ok: true, seqs: [4] });

    const all = await db.events.list(input.id);
    expect(all.map((e) => e.seq)).toEqual([1, 2, 3, 4]);
    expect(all[2]).toEqual({
      seq: 3,
      type: "move-sealed",
      at: 1_700_000_001_001,
      round: 1,
      seatIndex: 1,
      effort: 12.5,
      clientMoveId: "m-1700000001001",
      by: "seat",
    });
    expect((await db.events.list(input.id, 2)).map((e) => e.seq)).toEqual([3, 4]);
    expect(await db.events.list(input.id, 4)).toEqual([]);
    expect((await db.sessions.get(input.id))?.lastSeq).toBe(4);
  });

  it("events.append with a stale expectedLastSeq returns conflict and the current lastSeq", async () => {
    const { input } = sessionInput();
    await db.sessions.create(input);
    await db.events.append(input.id, 1, [note(1, "a")]);
    expect(await db.events.append(input.id, 1, [note(2, "b")])).toEqual({
      ok: false,
      code: "conflict",
      lastSeq: 2,
    });
    expect((await db.events.list(input.id)).map(label)).toEqual(["session-created", "a"]);
  });

  it("events.append to an unknown session returns not-found", async () => {
    expect(await db.events.append("no-such-session", 0, [note(1, "a")])).toEqual({
      ok: false,
      code: "not-found",
    });
  });

  it("two concurrent appends with the same expectedLastSeq: exactly one wins", async () => {
    const { input } = sessionInput();
    await db.sessions.create(input);
    const results = await Promise.all([
      db.events.append(input.id, 1, [note(10, "first")]),
      db.events.append(input.id, 1, [note(11, "second")]),
    ]);
    const winners = results.filter((r) => r.ok);
    const losers = results.filter((r) => !r.ok);
    expect(winners).toEqual([{ ok: true, seqs: [2] }]);
    expect(losers).toEqual([{ ok: false, code: "conflict", lastSeq: 2 }]);
    const log = await db.events.list(input.id);
    expect(log).toHaveLength(2);
    expect(["first", "second"]).toContain(label(log[1]!));
  });

  it("appends to many sessions at once (group commit): a stale and an unknown one fail alone", async () => {
    const inputs = Array.from({ length: 6 }, () => sessionInput().input);
    for (const input of inputs) await db.sessions.create(input);
    const [stale, ...fresh] = inputs;
    await db.events.append(stale!.id, 1, [note(5, "earlier")]);
    // All calls start in the same turn of the event loop, so they share transactions.
    const results = await Promise.all([
      db.events.append(stale!.id, 1, [note(6, "late")]),
      db.events.append("no-such-session", 0, [note(6, "lost")]),
      ...fresh.map((input, k) =>
        db.events.append(input.id, 1, [note(7, `a${k}`), sealed(8, 0, 0.1 + 0.2)], {
          status: k === 0 ? "open" : undefined,
        }),
      ),
    ]);
    expect(results).toEqual([
      { ok: false, code: "conflict", lastSeq: 2 },
      { ok: false, code: "not-found" },
      ...fresh.map(() => ({ ok: true, seqs: [2, 3] })),
    ]);
    expect((await db.events.list(stale!.id)).map(label)).toEqual(["session-created", "earlier"]);
    for (const [k, input] of fresh.entries()) {
      expect(await db.events.list(input.id, 1)).toEqual([
        { seq: 2, type: "round-noted", at: 7, round: 1, text: `a${k}` },
        {
          seq: 3,
          type: "move-sealed",
          at: 8,
          round: 1,
          seatIndex: 0,
          effort: 0.1 + 0.2,
          clientMoveId: "m-8",
          by: "seat",
        },
      ]);
      const session = await db.sessions.get(input.id);
      expect(session).toMatchObject({ lastSeq: 3, status: k === 0 ? "open" : "lobby" });
    }
  });

  it("a 0 ms timer set behind a backlog of appends fires before the backlog is committed", async () => {
    const inputs = Array.from({ length: 10 }, () => sessionInput().input);
    for (const input of inputs) await db.sessions.create(input);
    const rounds = 10;
    let committed = 0;
    let committedWhenTimerFired = -1;
    const writers = inputs.map(async (input) => {
      for (let seq = 1; seq <= rounds; seq++) {
        const result = await db.events.append(input.id, seq, [note(seq, "tick")]);
        expect(result.ok).toBe(true);
        committed++;
      }
    });
    setTimeout(() => (committedWhenTimerFired = committed), 0);
    await Promise.all(writers);
    expect(committed).toBe(inputs.length * rounds);
    // Commits start from a fresh turn of the event loop, so the timer's phase comes round.
    expect(committedWhenTimerFired).toBeGreaterThanOrEqual(0);
    expect(committedWhenTimerFired).toBeLessThan(inputs.length * rounds);
  });

  it("eight writers that retry on conflict leave a gapless log with every event once", async () => {
    const { input } = sessionInput();
    await db.sessions.create(input);
    const writers = Array.from({ length: 8 }, async (_, w) => {
      let expected = 1;
      for (let attempt = 0; attempt < 50; attempt++) {
        const result = await db.events.append(input.id, expected, [note(w, `w${w}`)]);
        if (result.ok) return attempt;
        if (result.code !== "conflict") throw new Error(`unexpected ${result.code}`);
        expected = result.lastSeq;
      }
      throw new Error("writer starved");
    });
    await Promise.all(writers);
    const log = await db.events.list(input.id);
    expect(log.map((e) => e.seq)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
    const writersSeen = log.slice(1).map(label);
    expect([...writersSeen].sort()).toEqual(["w0", "w1", "w2", "w3", "w4", "w5", "w6", "w7"]);
  });

  it("events.append effects: status, seat claim and key commit with the events", async () => {
    const { input } = sessionInput();
    await db.sessions.create(input);
    const claimKey = newKey();
    const claim = await db.events.append(input.id, 1, [claimed(5, 0, "Ada")], {
      status: "lobby",
      claimSeats: [{ seatIndex: 0, displayName: "Ada" }],
      addKeys: [{ role: "seat", seatIndex: 0, plaintext: claimKey }],
    });
    expect(claim).toEqual({ ok: true, seqs: [2] });
    const seat = (await seatsOf(db, input.id))[0]!;
    expect(seat.displayName).toBe("Ada");
    expect(seat.claimedAt).toBeInstanceOf(Date);
    expect(await db.keys.resolve(input.id, claimKey)).toEqual({ role: "seat", seatIndex: 0 });

    const open = await db.events.append(input.id, 2, [opened(6)], { status: "open" });
    expect(open.ok).toBe(true);
    expect((await db.sessions.get(input.id))?.status).toBe("open");
  });

  it("events.append claiming a taken seat rolls back events, status and keys", async () => {
    const { input } = sessionInput();
    await db.sessions.create(input);
    await takeSeat(db, input.id, 1, "Bo");
    const lateKey = newKey();
    const result = await db.events.append(input.id, 1, [claimed(7, 1, "Cy")], {
      status: "should-not-stick",
      claimSeats: [{ seatIndex: 1, displayName: "Cy" }],
      addKeys: [{ role: "seat", seatIndex: 1, plaintext: lateKey }],
    });
    expect(result).toEqual({ ok: false, code: "seat-claimed", seatIndex: 1 });
    const session = await db.sessions.get(input.id);
    expect(session?.lastSeq).toBe(1);
    expect(session?.status).toBe("lobby");
    expect(session?.seats[1]?.displayName).toBe("Bo");
    expect(await db.events.list(input.id)).toHaveLength(1);
    expect(await db.keys.resolve(input.id, lateKey)).toBeNull();
  });

  it("seat claims without keys share a group commit: claims commit with their events, a taken seat fails its member alone", async () => {
    const inputs = Array.from({ length: 4 }, () => sessionInput().input);
    for (const input of inputs) await db.sessions.create(input);
    const [plain, claiming, takenOne, missing] = inputs;
    await takeSeat(db, takenOne!.id, 0, "Early");
    // names a person may type, which the statement binds as array elements
    const awkward = `O'Neil "Ned" \\ {1,2} NULL é漢`;
    const claim = (id: string, seatIndex: number, displayName: string) =>
      db.events.append(id, 1, [claimed(9, seatIndex, displayName)], {
        claimSeats: [{ seatIndex, displayName }],
      });
    // All calls start in the same turn of the event loop, so they share transactions.
    const results = await Promise.all([
      db.events.append(plain!.id, 1, [note(9, "plain")]),
      claim(claiming!.id, 0, awkward),
      claim(takenOne!.id, 0, "Late"),
      claim(missing!.id, 7, "Nobody"),
    ]);
    expect(results).toEqual([
      { ok: true, seqs: [2] },
      { ok: true, seqs: [2] },
      { ok: false, code: "seat-claimed", seatIndex: 0 },
      { ok: false, code: "seat-claimed", seatIndex: 7 },
    ]);
    const seat = (await seatsOf(db, claiming!.id))[0]!;
    expect(seat.displayName).toBe(awkward);
    expect(seat.claimedAt).toBeInstanceOf(Date);
    expect(await db.events.list(claiming!.id, 1)).toEqual([
      { seq: 2, type: "seat-claimed", at: 9, seatIndex: 0, displayName: awkward },
    ]);
    for (const failed of [takenOne!, missing!]) {
      expect((await db.sessions.get(failed.id))?.lastSeq).toBe(1);
      expect(await db.events.list(failed.id)).toHaveLength(1);
    }
    expect((await seatsOf(db, takenOne!.id))[0]?.displayName).toBe("Early");
  });

  it("two claims of one seat with the same expectedLastSeq: the first wins, the second is a conflict", async () => {
    const { input } = sessionInput();
    await db.sessions.create(input);
    const claim = (displayName: string) =>
      db.events.append(input.id, 1, [claimed(9, 0, displayName)], {
        claimSeats: [{ seatIndex: 0, displayName }],
      });
    const [first, second] = await Promise.all([claim("Ann"), claim("Ben")]);
    expect(first).toEqual({ ok: true, seqs: [2] });
    expect(second).toEqual({ ok: false, code: "conflict", lastSeq: 2 });
    expect((await seatsOf(db, input.id))[0]?.displayName).toBe("Ann");
    // asked again on the current seq, the taken seat is what stops it
    expect(
      await db.events.append(input.id, 2, [claimed(9, 0, "Ben")], {
        claimSeats: [{ seatIndex: 0, displayName: "Ben" }],
      }),
    ).toEqual({ ok: false, code: "seat-claimed", seatIndex: 0 });
  });

  it("keys are stored as sha256 hex only; resolve works; wrong key or session gives null", async () => {
    const { input, facilitatorKey, seatKeys } = sessionInput();
    await db.sessions.create(input);
    const spectatorKey = newKey();
    await db.keys.add(input.id, "spectator", null, spectatorKey);

    const rows = await db.prisma.accessKey.findMany({ where: { sessionId: input.id } });
    expect(rows).toHaveLength(4);
    const plaintexts = [facilitatorKey, ...seatKeys, spectatorKey];
    const stored = JSON.stringify(rows);
    for (const key of plaintexts) expect(stored).not.toContain(key);
    expect(rows.map((r) => r.hash).sort()).toEqual(plaintexts.map(hashKey).sort());
    for (const row of rows) expect(row.hash).toMatch(/^[0-9a-f]{64}$/);

    expect(await db.keys.resolve(input.id, seatKeys[1]!)).toEqual({ role: "seat", seatIndex: 1 });
    expect(await db.keys.resolve(input.id, spectatorKey)).toEqual({
      role: "spectator",
      seatIndex: null,
    });
    expect(await db.keys.resolve(input.id, newKey())).toBeNull();
    expect(await db.keys.resolve(input.id, facilitatorKey.slice(0, -1))).toBeNull();

    const other = sessionInput();
    await db.sessions.create(other.input);
    expect(await db.keys.resolve(other.input.id, facilitatorKey)).toBeNull();
  });

  it("sessions.list() is newest first, without scenarios", async () => {
    const { input } = sessionInput();
    await db.sessions.create(input);

    const list = await db.sessions.list();
    expect(list[0]?.id).toBe(input.id);
    expect(list[0]).not.toHaveProperty("scenario");
    const created = list.map((s) => s.createdAt.getTime());
    expect(created).toEqual([...created].sort((x, y) => y - x));
  });

  it("events.countOfType(type) counts per session", async () => {
    const { input } = sessionInput();
    await db.sessions.create(input);
    await db.events.append(input.id, 1, [resolved(1), opened(2), resolved(3)]);
    const counts = await db.events.countOfType("round-resolved");
    expect(counts[input.id]).toBe(2);
  });

  it("events.list refuses a stored event the protocol's schema does not accept, naming seq and field", async () => {
    const { input } = sessionInput();
    await db.sessions.create(input);
    // append stores what the server hands it; only reading checks it
    await db.events.append(input.id, 1, [sealed(5, 0, 12.5)]);
    expect(await db.events.list(input.id, 1)).toMatchObject([{ seq: 2, effort: 12.5 }]);
    await db.events.append(input.id, 2, [sealed(6, 1, -1)]);
    await expect(db.events.list(input.id)).rejects.toThrow(
      /stored event 3 \(move-sealed\) does not parse: effort: must be >= 0/,
    );
    await db.events.append(input.id, 3, [{ type: "no-such-event", at: 7, payload: {} }]);
    await expect(db.events.list(input.id, 3)).rejects.toThrow(/stored event 4 \(no-such-event\)/);
  });
});

describe.skipIf(!TEST_DATABASE_URL)("two server processes sharing one PostgreSQL", () => {
  it("openDatabase() twice at once: the migration runs once; racing appends: exactly one wins", async () => {
    const backend = backends.find((b) => b.name === "postgresql")!;
    const fresh = await backend.fresh();
    // Two Database objects have separate pools and Prisma clients, like two processes.
    const [a, b] = await Promise.all([
      openDatabase({ url: fresh.url }),
      openDatabase({ url: fresh.url }),
    ]);
    try {
      // every migration applied by exactly one of the two
      expect([...a.migrationsApplied, ...b.migrationsApplied].sort()).toEqual(
        readMigrations().map((m) => m.name),
      );
      const { input } = sessionInput();
      await a.sessions.create(input);
      for (let round = 0; round < 5; round++) {
        const expected = 1 + round;
        const results = await Promise.all([
          a.events.append(input.id, expected, [note(round, "from-a")]),
          b.events.append(input.id, expected, [note(round, "from-b")]),
        ]);
        expect(results.filter((r) => r.ok)).toEqual([{ ok: true, seqs: [expected + 1] }]);
        expect(results.filter((r) => !r.ok)).toEqual([
          { ok: false, code: "conflict", lastSeq: expected + 1 },
        ]);
      }
      expect((await b.events.list(input.id)).map((e) => e.seq)).toEqual([1, 2, 3, 4, 5, 6]);
      // racing seat claims: the seat goes to exactly one, with exactly one event
      const claim = (db: Database, displayName: string) =>
        db.events.append(input.id, 6, [claimed(9, 0, displayName)], {
          claimSeats: [{ seatIndex: 0, displayName }],
        });
      const claims = await Promise.all([claim(a, "from-a"), claim(b, "from-b")]);
      expect(claims.filter((r) => r.ok)).toEqual([{ ok: true, seqs: [7] }]);
      expect(claims.filter((r) => !r.ok)).toEqual([{ ok: false, code: "conflict", lastSeq: 7 }]);
      const winner = claims[0]!.ok ? "from-a" : "from-b";
      expect((await seatsOf(a, input.id))[0]?.displayName).toBe(winner);
      expect(await a.events.list(input.id, 6)).toEqual([
        { seq: 7, type: "seat-claimed", at: 9, seatIndex: 0, displayName: winner },
      ]);
    } finally {
      await a.close();
      await b.close();
      await fresh.dispose();
    }
  });
});
