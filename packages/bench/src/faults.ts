/**
 * Fault runs against the real server; each prints what it tried and what survived.
 *   npx tsx src/faults.ts [--only crash,duplicates,slow,fuzz] [--fuzz 10000] [--json]
 * 1. crash: SIGKILL while seats are sealing, restart on the same data directory, reconnect.
 * 2. duplicates and out-of-order commands.
 * 3. slow clients that stop reading their socket.
 * 4. fuzzed messages; the event log must be unchanged except for legit events.
 * Asserts nothing; reports pass/fail per check.
 */
import { mulberry32 } from "@contend/solver";
import { isDeepStrictEqual } from "node:util";
import { fileURLToPath } from "node:url";
import { createSession, exportEvents, healthy, kioskScenario, missingMoves } from "./api";
import type { AckedMove, CreatedSession, ExportedEvent } from "./api";
import { freePort, startServer, tempDir } from "./child";
import type { Child } from "./child";
import { inBatches, SessionClient, sleep } from "./client";
import type { AckLike } from "./client";
import { flag, hasFlag, intFlag } from "./flags";
import { RawClient } from "./raw";
import { rssMiB } from "./proc";
import { summarize } from "./stats";
import { markdownTable } from "./table";
import type { Cell } from "./table";

export interface Check {
  check: string;
  expected: string;
  got: string;
  pass: boolean;
}

export interface FaultReport {
  name: string;
  tried: string;
  figures: Array<[string, Cell]>;
  checks: Check[];
}

const check = (name: string, expected: string, got: Cell, pass: boolean): Check => ({
  check: name,
  expected,
  got: typeof got === "string" ? got : String(got),
  pass,
});

interface Table {
  created: CreatedSession;
  facilitator: SessionClient;
  seats: SessionClient[];
}

async function seatTable(url: string, created: CreatedSession, reconnect = false): Promise<Table> {
  const facilitator = new SessionClient({
    url,
    reconnect,
    ackTimeoutMs: 10_000,
    credentials: { role: "facilitator", sessionId: created.id, key: created.facilitatorKey },
  });
  const seats = created.seats.map(
    (s) =>
      new SessionClient({
        url,
        reconnect,
        ackTimeoutMs: 10_000,
        credentials: { role: "seat", sessionId: created.id, key: s.key! },
      }),
  );
  for (const c of [facilitator, ...seats]) {
    await c.connect();
    const ack = await c.hello();
    if (!ack.ok) throw new Error(`hello failed: ${ack.code} ${ack.message}`);
  }
  return { created, facilitator, seats };
}

function closeTable(t: Table) {
  for (const c of [t.facilitator, ...t.seats]) c.close();
}

/** Opens round `round`, seals every seat, waits for the resolved view. */
async function playRound(t: Table, round: number, acked: AckedMove[]): Promise<boolean> {
  const reveal = t.facilitator.waitForView((v) => v.rounds.length >= round, 20_000);
  const opened = await t.facilitator.command({ type: "openRound", durationSeconds: null });
  if (!opened.ok) return false;
  await Promise.all(
    t.seats.map(async (seat, seatIndex) => {
      const clientMoveId = `play-${round}-${seatIndex}`;
      const effort = 20 + seatIndex;
      const ack = await seat.command({ type: "sealMove", clientMoveId, effort, round });
      if (ack.ok) acked.push({ sessionId: t.created.id, round, seatIndex, clientMoveId, effort });
    }),
  );
  return (await reveal) !== null;
}

async function newServer(dataDir?: string, port?: number, env?: Record<string, string>) {
  const dir = dataDir ?? tempDir("contend-faults-");
  const p = port ?? (await freePort());
  return { server: await startServer({ dataDir: dir, port: p, env }), dataDir: dir, port: p };
}

// ---------------------------------------------------------------------------------------------

export async function crashRun(opts: { sessions: number; seats: number }): Promise<FaultReport> {
  const rounds = 3;
  const first = await newServer();
  const { dataDir, port } = first;
  let server = first.server;
  const url = server.url;
  try {
    const created = await inBatches(Array.from({ length: opts.sessions }), 4, () =>
      createSession(url, kioskScenario(opts.seats, rounds)),
    );
    const tables = await inBatches(created, 4, (c) => seatTable(url, c, true));
    const acked: AckedMove[] = [];
    for (const t of tables) await playRound(t, 1, acked);

    // Round 2: seats seal over 2 s; the server is killed after 1 s.
    const preKill: AckedMove[] = [];
    const pending = new Map<
      string,
      { table: Table; seatIndex: number; clientMoveId: string; effort: number }
    >();
    let killed = false;
    for (const t of tables) {
      const opened = await t.facilitator.command({ type: "openRound", durationSeconds: null });
      if (!opened.ok) throw new Error(`openRound before the crash: ${opened.code}`);
    }
    let inFlight = 0;
    const sealing = tables.flatMap((t) =>
      t.seats.map(async (seat, seatIndex) => {
        const clientMoveId = `crash-2-${seatIndex}`;
        const effort = 30 + seatIndex;
        const key = `${t.created.id}:${seatIndex}`;
        pending.set(key, { table: t, seatIndex, clientMoveId, effort });
        await sleep(Math.random() * 2000);
        if (killed) return;
        inFlight++;
        const ack = await seat.command({ type: "sealMove", clientMoveId, effort, round: 2 });
        inFlight--;
        if (ack.ok && !killed) {
          const move = { sessionId: t.created.id, round: 2, seatIndex, clientMoveId, effort };
          preKill.push(move);
          pending.delete(key);
        }
      }),
    );
    await sleep(1000);
    const ackedAtKill = preKill.length;
    const inFlightAtKill = inFlight;
    killed = true;
    await server.kill("SIGKILL");
    const preKillSnapshot = [...preKill];
    void Promise.all(sealing);

    const tRestart = performance.now();
    server = (await newServer(dataDir, port)).server;
    const restartSeconds = (performance.now() - tRestart) / 1000;

    // Every client reconnects by itself and says hello again (with lastSeq).
    const everyone = tables.flatMap((t) => [t.facilitator, ...t.seats]);
    const until = Date.now() + 60_000;
    while (Date.now() < until && everyone.some((c) => c.hellos < 2)) await sleep(100);
    const rehelloed = everyone.filter((c) => c.hellos >= 2).length;
    const reconnectSeconds = (performance.now() - tRestart) / 1000;

    // Acked before the kill: the seat's own view after restart must show that move, as its
    // sealed effort while the round is open, or in the round's result if every seat of that
    // session had sealed before the kill (the last seal and the close are one commit).
    let presentInViews = 0;
    for (const m of preKillSnapshot) {
      const t = tables.find((x) => x.created.id === m.sessionId)!;
      const view = t.seats[m.seatIndex]!.lastView;
      const you = view?.you;
      const resolved = (view?.rounds as { round: number; efforts: number[] }[] | undefined)?.find(
        (r) => r.round === m.round,
      );
      if (
        (you && you.clientMoveId === m.clientMoveId && you.sealedEffort === m.effort) ||
        resolved?.efforts[m.seatIndex] === m.effort
      )
        presentInViews++;
    }

    // Seats without an acked move seal now (same clientMoveId: a resend of an in-flight move is
    // the same move); the round closes when all have sealed; round 3 finishes the session.
    let resent = 0;
    await Promise.all(
      [...pending.values()].map(async (p) => {
        const ack = await p.table.seats[p.seatIndex]!.command({
          type: "sealMove",
          clientMoveId: p.clientMoveId,
          effort: p.effort,
          round: 2,
        });
        if (ack.ok) {
          resent++;
          acked.push({
            sessionId: p.table.created.id,
            round: 2,
            seatIndex: p.seatIndex,
            clientMoveId: p.clientMoveId,
            effort: p.effort,
          });
        }
      }),
    );
    acked.push(...preKillSnapshot);
    let revealed2 = 0;
    for (const t of tables) {
      if ((await t.facilitator.waitForView((v) => v.rounds.length >= 2, 20_000)) !== null)
        revealed2++;
    }
    let finished = 0;
    for (const t of tables) {
      if (await playRound(t, 3, acked)) finished++;
    }
    const logs = new Map<string, ExportedEvent[]>();
    for (const c of created) logs.set(c.id, await exportEvents(server.url, c.id));
    const lost = missingMoves(acked, logs);
    const lostPreKill = missingMoves(preKillSnapshot, logs);
    const ended = [...logs.values()].filter((ev) =>
      ev.some((e) => e.type === "session-ended"),
    ).length;
    for (const t of tables) closeTable(t);
    return {
      name: "crash and restart",
      tried:
        `${opts.sessions} sessions x ${opts.seats} seats; round 1 played; round 2 opened and seats sealing over 2 s; ` +
        `SIGKILL after 1 s; restart on the same data directory and port; clients reconnect, say hello again ` +
        `with lastSeq, resend unacknowledged moves with the same clientMoveId, finish rounds 2 and 3.`,
      figures: [
        ["moves acked before the kill", ackedAtKill],
        ["moves in flight at the kill (sent, no ack)", inFlightAtKill],
        ["restart to healthy (s)", restartSeconds],
        ["restart to every client said hello again (s)", reconnectSeconds],
        ["moves sealed after restart (resent or first sent)", resent],
        ["acked moves checked in the final logs", acked.length],
      ],
      checks: [
        check(
          "clients said hello again",
          `${everyone.length}`,
          rehelloed,
          rehelloed === everyone.length,
        ),
        check(
          "pre-kill acked moves in their seat's view after restart",
          `${preKillSnapshot.length}`,
          presentInViews,
          presentInViews === preKillSnapshot.length,
        ),
        check(
          "pre-kill acked moves in the final log",
          "0 lost",
          `${lostPreKill.length} lost`,
          lostPreKill.length === 0,
        ),
        check(
          "all acked moves in the final log",
          "0 lost",
          `${lost.length} lost of ${acked.length}`,
          lost.length === 0,
        ),
        check(
          "round 2 revealed after restart",
          `${tables.length}`,
          revealed2,
          revealed2 === tables.length,
        ),
        check(
          "sessions finished (round 3 played, session ended)",
          `${tables.length}`,
          `${finished} played, ${ended} ended`,
          finished === tables.length && ended === tables.length,
        ),
      ],
    };
  } finally {
    await server.kill("SIGKILL");
  }
}

// ---------------------------------------------------------------------------------------------

export async function duplicatesRun(): Promise<FaultReport> {
  const { server } = await newServer();
  try {
    const created = await createSession(server.url, kioskScenario(3, 2));
    const t = await seatTable(server.url, created);
    const [s0, s1, s2] = t.seats as [SessionClient, SessionClient, SessionClient];
    const checks: Check[] = [];
    const expectCode = (name: string, ack: AckLike, code: string) =>
      checks.push(
        check(name, code, ack.ok ? "ok" : String(ack.code), !ack.ok && ack.code === code),
      );
    const before = await exportEvents(server.url, created.id);

    expectCode(
      "seal before any round is open",
      await s0.command({ type: "sealMove", clientMoveId: "early", effort: 5 }),
      "wrong-state",
    );
    expectCode(
      "close before any round is open",
      await t.facilitator.command({ type: "closeRound" }),
      "wrong-state",
    );
    const afterEarly = await exportEvents(server.url, created.id);
    checks.push(
      check(
        "log unchanged by refused commands",
        `${before.length} events`,
        `${afterEarly.length} events`,
        isDeepStrictEqual(before, afterEarly),
      ),
    );

    const opened = await t.facilitator.command({ type: "openRound", durationSeconds: null });
    checks.push(check("open round 1", "ok", opened.ok ? "ok" : String(opened.code), opened.ok));
    expectCode(
      "open again while open",
      await t.facilitator.command({ type: "openRound", durationSeconds: null }),
      "wrong-state",
    );
    expectCode(
      "seal for round 2 while round 1 is open",
      await s0.command({ type: "sealMove", clientMoveId: "r2", effort: 5, round: 2 }),
      "wrong-state",
    );
    expectCode(
      "seat sends a facilitator command",
      await s0.command({ type: "closeRound" }),
      "forbidden",
    );
    expectCode(
      "facilitator sends a seat command",
      await t.facilitator.command({ type: "sealMove", clientMoveId: "f", effort: 1 }),
      "forbidden",
    );

    const first = await s0.command({
      type: "sealMove",
      clientMoveId: "dup-1",
      effort: 10,
      round: 1,
    });
    const repeats = await Promise.all(
      Array.from({ length: 20 }, () =>
        s0.command({ type: "sealMove", clientMoveId: "dup-1", effort: 10, round: 1 }),
      ),
    );
    const sameAcks = repeats.filter((a) => isDeepStrictEqual(a, first)).length;
    checks.push(
      check(
        "same clientMoveId sent 20 more times: same ack",
        "20 identical",
        `${sameAcks} identical`,
        first.ok && sameAcks === 20,
      ),
    );
    const changed = await s0.command({
      type: "sealMove",
      clientMoveId: "dup-1",
      effort: 99,
      round: 1,
    });
    checks.push(
      check(
        "same clientMoveId with another effort keeps the first move",
        "ack with effort 10",
        changed.ok ? `ack with effort ${String(changed.data?.effort)}` : String(changed.code),
        changed.ok && changed.data?.effort === 10,
      ),
    );
    const replaced = await s1.command({ type: "sealMove", clientMoveId: "a", effort: 7, round: 1 });
    const replaced2 = await s1.command({
      type: "sealMove",
      clientMoveId: "b",
      effort: 8,
      round: 1,
    });
    checks.push(
      check(
        "new clientMoveId before close replaces the move",
        "ok, ok",
        `${replaced.ok ? "ok" : replaced.code}, ${replaced2.ok ? "ok" : replaced2.code}`,
        replaced.ok && replaced2.ok,
      ),
    );

    const reveal = t.facilitator.waitForView((v) => v.rounds.length >= 1, 10_000);
    await s2.command({ type: "sealMove", clientMoveId: "c", effort: 9, round: 1 });
    const revealedAt = await reveal;
    checks.push(
      check(
        "round closes when all sealed",
        "revealed",
        revealedAt !== null ? "revealed" : "not revealed",
        revealedAt !== null,
      ),
    );
    expectCode(
      "close after the round closed",
      await t.facilitator.command({ type: "closeRound" }),
      "wrong-state",
    );
    expectCode("close twice", await t.facilitator.command({ type: "closeRound" }), "wrong-state");
    expectCode(
      "late seal for the closed round",
      await s0.command({ type: "sealMove", clientMoveId: "late", effort: 3, round: 1 }),
      "wrong-state",
    );

    const log = await exportEvents(server.url, created.id);
    const seals = log.filter((e) => e.type === "move-sealed" && e.round === 1);
    const resolved = log.filter((e) => e.type === "round-resolved");
    const efforts = (resolved[0]?.efforts as number[] | undefined) ?? [];
    checks.push(
      check(
        "move-sealed events in round 1",
        "4 (dup-1 once, a, b, c)",
        seals.length,
        seals.length === 4,
      ),
    );
    checks.push(
      check(
        "resolved efforts",
        "[10, 8, 9]",
        JSON.stringify(efforts),
        isDeepStrictEqual(efforts, [10, 8, 9]),
      ),
    );
    checks.push(check("one round-resolved", "1", resolved.length, resolved.length === 1));
    const seqs = log.map((e) => e.seq);
    checks.push(
      check(
        "seqs 1..n without gaps",
        `1..${log.length}`,
        `${seqs[0]}..${seqs[seqs.length - 1]}`,
        seqs.every((s, i) => s === i + 1),
      ),
    );
    closeTable(t);
    return {
      name: "duplicates and out-of-order",
      tried:
        "one session of 3 seats: seal and close before open, open twice, seal for the wrong round, wrong roles, 21 sends of one clientMoveId (20 at once), a changed effort under the same id, a replaced move, close twice, a late seal.",
      figures: [["events in the log at the end", log.length]],
      checks,
    };
  } finally {
    await server.kill("SIGKILL");
  }
}

// ---------------------------------------------------------------------------------------------

export async function slowRun(opts: { slow: number; rounds: number }): Promise<FaultReport> {
  const { server } = await newServer();
  try {
    const created = await createSession(server.url, kioskScenario(8, opts.rounds * 3));
    const spectatorKey = (created as unknown as { spectatorKey: string }).spectatorKey;
    const t = await seatTable(server.url, created);
    const acked: AckedMove[] = [];
    const timeRounds = async (from: number) => {
      const ms: number[] = [];
      let ok = 0;
      for (let r = from; r < from + opts.rounds; r++) {
        const t0 = performance.now();
        if (await playRound(t, r, acked)) ok++;
        ms.push(performance.now() - t0);
      }
      return { ok, ...summarize(ms) };
    };
    const alone = await timeRounds(1);

    // The same number of extra sockets, first reading normally, then stuck: the difference is
    // the cost of slowness alone, not of having more sockets to push views to.
    const readers = Array.from(
      { length: opts.slow },
      () =>
        new SessionClient({
          url: server.url,
          credentials: { role: "spectator", sessionId: created.id, key: spectatorKey },
        }),
    );
    for (const c of readers) {
      await c.connect();
      await c.hello();
    }
    const calm = await timeRounds(1 + opts.rounds);
    const rssCalm = rssMiB(server.pid) ?? Number.NaN;
    for (const c of readers) c.close();

    const slow: RawClient[] = [];
    let slowHello = 0;
    for (let i = 0; i < opts.slow; i++) {
      const c = new RawClient(server.url);
      if (await c.open()) {
        const hello = {
          protocol: 2,
          credentials: { role: "spectator", sessionId: created.id, key: spectatorKey },
        };
        const ack = (await c.emit("hello", hello)) as AckLike | undefined;
        if (ack?.ok) slowHello++;
      }
      c.stopReading();
      slow.push(c);
    }
    // a seat that also stops reading: its own views pile up on the server
    const stuckSeat = new RawClient(server.url);
    await stuckSeat.open();
    await stuckSeat.emit("hello", {
      protocol: 2,
      credentials: { role: "seat", sessionId: created.id, key: created.seats[0]!.key! },
    });
    stuckSeat.stopReading();

    const stressed = await timeRounds(1 + 2 * opts.rounds);
    const rssStressed = rssMiB(server.pid) ?? Number.NaN;
    const alive = await healthy(server.url);
    const closedByServer = slow.filter((c) => c.closed).length;
    for (const c of slow) c.close();
    stuckSeat.close();
    closeTable(t);
    const log = await exportEvents(server.url, created.id);
    const lost = missingMoves(acked, new Map([[created.id, log]]));
    return {
      name: "slow clients",
      tried:
        `8 seats play ${opts.rounds} rounds alone; then ${opts.rounds} rounds with ${opts.slow} spectator ` +
        `sockets that read normally; then those close and ${opts.slow} spectator sockets plus a second ` +
        `socket of seat 0 say hello and stop reading (no reads, no pongs) while the 8 seats play ` +
        `${opts.rounds} more rounds. The run is shorter than socket.io's ping timeout (25 s + 20 s), ` +
        `so the server is not expected to drop the stuck sockets.`,
      figures: [
        ["slow sockets that said hello", slowHello],
        [
          "round time, 8 seats alone, p50 / max (ms)",
          `${alone.p50.toFixed(1)} / ${alone.max.toFixed(1)}`,
        ],
        [
          "round time with reading sockets, p50 / max (ms)",
          `${calm.p50.toFixed(1)} / ${calm.max.toFixed(1)}`,
        ],
        [
          "round time with stuck sockets, p50 / max (ms)",
          `${stressed.p50.toFixed(1)} / ${stressed.max.toFixed(1)}`,
        ],
        [
          "server RSS with reading / with stuck sockets (MiB)",
          `${rssCalm.toFixed(1)} / ${rssStressed.toFixed(1)}`,
        ],
        ["slow sockets closed by the server during the run", closedByServer],
      ],
      checks: [
        check(
          "rounds completed with slow sockets attached",
          `${opts.rounds}`,
          stressed.ok,
          stressed.ok === opts.rounds,
        ),
        check(
          "round time p50 with stuck sockets at most 2x with the same number reading",
          `<= ${(2 * calm.p50).toFixed(1)} ms`,
          `${stressed.p50.toFixed(1)} ms`,
          stressed.p50 <= 2 * calm.p50,
        ),
        check("server answers /api/health", "ok", alive ? "ok" : "no answer", alive),
        check(
          "acked moves in the log",
          "0 lost",
          `${lost.length} lost of ${acked.length}`,
          lost.length === 0,
        ),
      ],
    };
  } finally {
    await server.kill("SIGKILL");
  }
}

// ---------------------------------------------------------------------------------------------

// Seeded draws (the solver's mulberry32), so reruns draw the same values.
const rng = mulberry32;

interface FuzzIdentity {
  sessionId: string | null;
  hello: string;
}

const WEIRD_NUMBERS = [
  "NaN",
  "Infinity",
  "-Infinity",
  "1e400",
  "-1e400",
  "1e308",
  "-1",
  "-0",
  "1e12",
  "1e13",
  "0.5",
  "9007199254740993",
  "null",
  '"12"',
  "[]",
  "{}",
  "true",
];
// endSession is left out: one legit hit ends a fuzzed session and the rest of the run would only
// meet wrong-state; ending is covered by the crash run.
const COMMAND_TYPES = [
  "openRound",
  "closeRound",
  "applyShock",
  "pause",
  "resume",
  "setSeatPolicy",
  "sealMove",
  "claimSeat",
  "hello",
  "",
  "__proto__",
  "constructor",
  "x".repeat(300),
];

/** One fuzzed packet: text, and whether it carries an ack id we should wait for. */
function fuzzPacket(
  random: () => number,
  ctx: { sessions: CreatedSession[] },
): { text: string; kind: string; hello?: FuzzIdentity } {
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(random() * xs.length)]!;
  const num = () => pick(WEIRD_NUMBERS);
  const s = pick(ctx.sessions);
  const roll = random();
  if (roll < 0.05)
    return {
      kind: "malformed",
      text: pick([
        "42[",
        "42{}",
        "4",
        "99",
        "42",
        '42["command"',
        "421abc",
        "40",
        "41",
        "6",
        '452-["command",{"_placeholder":true,"num":0}]',
        "\u0000",
      ]),
    };
  if (roll < 0.07)
    return {
      kind: "oversized",
      text: `42["command",{"type":"sealMove","clientMoveId":"${"y".repeat(70_000)}","effort":1}]`,
    };
  if (roll < 0.1)
    return { kind: "no-ack", text: `42["command",{"type":"${pick(COMMAND_TYPES)}"}]` };
  let body: string;
  const type = pick(COMMAND_TYPES);
  const field = random();
  if (field < 0.3)
    body = `{"type":"sealMove","clientMoveId":${pick(['"m"', '""', "1", "null", `"${"z".repeat(65)}"`])},"effort":${num()}${random() < 0.5 ? `,"round":${num()}` : ""}}`;
  else if (field < 0.45) body = `{"type":"openRound","durationSeconds":${num()}}`;
  else if (field < 0.55)
    body = `{"type":"applyShock","changes":[{"target":"${pick(["rival", "prize", "csf", "add-rival", "retire-rival", "moon"])}","index":${num()},"field":"${pick(["cost", "value", "budget", "weight", "decisiveness", "__proto__"])}","value":${num()}}]}`;
  else if (field < 0.65)
    body = `{"type":"setSeatPolicy","seatIndex":${num()},"policy":${pick(["null", '{"kind":"equilibrium"}', '{"kind":"nope"}', "1"])}}`;
  else if (field < 0.75)
    body = `{"type":"claimSeat","seatIndex":${num()},"displayName":${pick(['"Ann"', '""', "null", `"${"n".repeat(100)}"`])}}`;
  else if (field < 0.8) body = `{"__proto__":{"polluted":true},"type":"${type}"}`;
  else if (field < 0.85)
    body = JSON.stringify({
      type,
      extra: num(),
      nested: JSON.parse('{"a":{"b":{"c":[1,2,{"d":null}]}}}'),
    });
  else if (field < 0.9) body = `[${num()},${num()}]`;
  else body = `{"type":"${type}"}`;
  const event =
    random() < 0.9
      ? "command"
      : pick(["hello", "view", "", "connect", "disconnect", "x".repeat(500)]);
  void s;
  if (event === "hello") {
    // a second hello on the same socket switches its identity when it succeeds
    const hello = fuzzHello(random, ctx);
    return { kind: "event:hello", text: `42{ID}["hello",${hello.hello}]`, hello };
  }
  return {
    kind: event === "command" ? "command" : `event:${event.slice(0, 12)}`,
    text: `42{ID}[${JSON.stringify(event)},${body}]`,
  };
}

function fuzzHello(random: () => number, ctx: { sessions: CreatedSession[] }): FuzzIdentity {
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(random() * xs.length)]!;
  const a = pick(ctx.sessions);
  const b = pick(ctx.sessions);
  const seat = pick(a.seats);
  const roll = random();
  const cred = (role: string, sessionId: string, key: string) =>
    `{"protocol":1,"credentials":{"role":"${role}","sessionId":"${sessionId}","key":"${key}"}}`;
  if (roll < 0.25) return { sessionId: a.id, hello: cred("seat", a.id, seat.key!) };
  if (roll < 0.4) return { sessionId: a.id, hello: cred("facilitator", a.id, a.facilitatorKey) };
  if (roll < 0.5)
    return { sessionId: null, hello: cred("seat", b.id === a.id ? "nope" : b.id, seat.key!) };
  if (roll < 0.6) return { sessionId: null, hello: cred("facilitator", a.id, seat.key!) };
  if (roll < 0.7)
    return {
      sessionId: null,
      hello: `{"protocol":${pick(["2", "0", "NaN", '"1"', "1e400"])},"credentials":{"role":"seat","sessionId":"${a.id}","key":"${seat.key}"}}`,
    };
  if (roll < 0.8)
    return {
      sessionId: null,
      hello: `{"protocol":1,"credentials":{"role":"${pick(["admin", "guest", "", "system"])}","sessionId":"${a.id}","key":"${"k".repeat(200)}","joinCode":${pick(['"AAAA"', "1", '"x"'])}}}`,
    };
  return {
    sessionId: null,
    hello: pick([
      "null",
      "1",
      '"hello"',
      "[]",
      `{"protocol":1}`,
      `{"protocol":1,"credentials":{"role":"seat","sessionId":"${"s".repeat(70)}","key":"k"}}`,
    ]),
  };
}

export async function fuzzRun(opts: {
  messages: number;
  connections: number;
  seed: number;
}): Promise<FaultReport> {
  const { server } = await newServer();
  const pid = server.pid;
  try {
    const sessions = await Promise.all(
      [0, 1, 2].map(() => createSession(server.url, kioskScenario(4, 50))),
    );
    const tables = await Promise.all(sessions.map((c) => seatTable(server.url, c)));
    const acked: AckedMove[] = [];
    for (const t of tables) await playRound(t, 1, acked);
    const before = new Map<string, ExportedEvent[]>();
    for (const s of sessions) before.set(s.id, await exportEvents(server.url, s.id));

    const random = rng(opts.seed);
    const ctx = { sessions };
    const outcomes: Record<string, number> = {};
    const okSeqs = new Map<string, number>(); // session -> highest seq in an ok ack from a fuzzer
    let sent = 0;
    let closedByServer = 0;
    let healthFailures = 0;
    const perConnection = Math.ceil(opts.messages / opts.connections);
    const count = (k: string) => (outcomes[k] = (outcomes[k] ?? 0) + 1);
    const started = performance.now();
    const healthProbe = setInterval(() => {
      void healthy(server.url).then((ok) => {
        if (!ok) healthFailures++;
      });
    }, 500);

    await Promise.all(
      Array.from({ length: opts.connections }, async () => {
        let quota = perConnection;
        // reconnect whenever the server drops us (malformed or oversized packets close the socket)
        for (let attempt = 0; quota > 0 && attempt < 200; attempt++) {
          const c = new RawClient(server.url);
          if (!(await c.open())) {
            count("connect failed");
            c.close();
            await sleep(50);
            continue;
          }
          const id = fuzzHello(random, ctx);
          const helloAck = (await c.emitText("hello", id.hello)) as AckLike | undefined;
          sent++;
          quota--;
          count(
            `hello:${helloAck === undefined ? "no answer" : helloAck.ok ? "ok" : helloAck.code}`,
          );
          let identity = helloAck?.ok ? id.sessionId : null;
          while (quota > 0 && !c.closed) {
            const p = fuzzPacket(random, ctx);
            const ackId = p.text.includes("{ID}") ? 1_000_000 + sent : null;
            const text = p.text.replace("{ID}", ackId === null ? "" : String(ackId));
            const ack = (await c.sendRaw(text, ackId, 10_000)) as AckLike | undefined;
            if (p.hello && ack?.ok) identity = p.hello.sessionId;
            sent++;
            quota--;
            const k =
              ackId === null
                ? `${p.kind}:sent`
                : ack === undefined
                  ? `${p.kind}:no answer`
                  : ack.ok
                    ? `${p.kind}:ok`
                    : `${p.kind}:${ack.code}`;
            count(k);
            if (ack?.ok && identity && typeof ack.data?.seq === "number") {
              okSeqs.set(identity, Math.max(okSeqs.get(identity) ?? 0, ack.data.seq));
            }
            // stay under the per-socket rate limit (20 per second) so messages reach validation
            await sleep(55);
          }
          if (c.closed) closedByServer++;
          c.close();
        }
      }),
    );
    clearInterval(healthProbe);
    const fuzzSeconds = (performance.now() - started) / 1000;

    // A legit facilitator resumes and closes any round the fuzzers paused or opened, so the
    // export shows everything.
    for (const t of tables) {
      const resumed = await t.facilitator.command({ type: "resume" });
      if (resumed.ok && typeof resumed.data?.seq === "number")
        okSeqs.set(t.created.id, Math.max(okSeqs.get(t.created.id) ?? 0, resumed.data.seq));
      const r = await t.facilitator.command({ type: "closeRound" });
      if (r.ok && typeof r.data?.seq === "number")
        okSeqs.set(t.created.id, Math.max(okSeqs.get(t.created.id) ?? 0, r.data.seq));
    }
    const checks: Check[] = [];
    const logsFresh: string[] = [];
    let unexplained = 0;
    let prefixesIntact = 0;
    let legitEvents = 0;
    let gapless = 0;
    for (const s of sessions) {
      const a = before.get(s.id)!;
      const b = await exportEvents(server.url, s.id);
      if (isDeepStrictEqual(b.slice(0, a.length), a)) prefixesIntact++;
      const added = b.slice(a.length);
      legitEvents += added.length;
      const limit = okSeqs.get(s.id) ?? 0;
      unexplained += added.filter((e) => e.seq > limit).length;
      if (b.every((e, i) => e.seq === i + 1)) gapless++;
    }
    // the server still plays a normal round
    let playable = 0;
    let endedByFuzz = 0;
    for (const t of tables) {
      const t2 = await seatTable(server.url, t.created);
      const view = t2.facilitator.lastView;
      if (view?.status === "ended") endedByFuzz++;
      else if (await playRound(t2, (view?.rounds.length ?? 0) + 1, acked)) playable++;
      closeTable(t2);
    }
    const fresh = await seatTable(server.url, await createSession(server.url, kioskScenario(4, 2)));
    const freshPlays = await playRound(fresh, 1, acked);
    logsFresh.push(fresh.created.id);
    closeTable(fresh);
    for (const t of tables) closeTable(t);
    const logs = new Map<string, ExportedEvent[]>();
    for (const id of [...sessions.map((s) => s.id), ...logsFresh])
      logs.set(id, await exportEvents(server.url, id));
    const lost = missingMoves(acked, logs);
    const alive = await healthy(server.url);
    const samePid = server.proc.exitCode === null && server.pid === pid;
    checks.push(
      check(
        "event log before the fuzz unchanged (prefix identical)",
        `${sessions.length} sessions`,
        prefixesIntact,
        prefixesIntact === sessions.length,
      ),
      check(
        "every new event explained by an ok ack",
        "0 unexplained",
        `${unexplained} unexplained of ${legitEvents} new`,
        unexplained === 0,
      ),
      check(
        "seqs 1..n without gaps",
        `${sessions.length} sessions`,
        gapless,
        gapless === sessions.length,
      ),
      check(
        "server answered /api/health during the fuzz (probe every 0.5 s)",
        "0 failures",
        `${healthFailures} failures`,
        healthFailures === 0,
      ),
      check(
        "server alive after the fuzz (same process)",
        "alive",
        alive && samePid ? "alive" : "down",
        alive && samePid,
      ),
      check(
        "a normal round plays after the fuzz in each fuzzed session not ended by it",
        `${sessions.length - endedByFuzz}`,
        playable,
        playable === sessions.length - endedByFuzz,
      ),
      check(
        "a new session plays a round after the fuzz",
        "yes",
        freshPlays ? "yes" : "no",
        freshPlays,
      ),
      check(
        "acked legit moves in the log",
        "0 lost",
        `${lost.length} lost of ${acked.length}`,
        lost.length === 0,
      ),
    );
    const top = Object.entries(outcomes).sort((x, y) => y[1] - x[1]);
    return {
      name: "fuzz",
      tried: `${sent} messages over ${opts.connections} raw WebSocket connections (seed ${opts.seed}), ~18 per second per connection: random event names, NaN/Infinity/1e400/huge/negative numbers, strings for numbers, wrong roles, keys of other sessions, bad protocol versions, prototype keys, malformed socket.io packets, packets without ack ids, 70 kB messages; reconnecting whenever the server closed the socket.`,
      figures: [
        ["messages sent", sent],
        ["seconds", fuzzSeconds],
        ["connections closed by the server (malformed, oversized or flooding)", closedByServer],
        ["new events from legit (ok-acked) fuzz commands", legitEvents],
        ["fuzzed sessions ended by a legit fuzzed endSession", endedByFuzz],
        ...top.map(([k, v]) => [`outcome ${k}`, v] as [string, Cell]),
      ],
      checks,
    };
  } finally {
    await server.kill("SIGKILL");
  }
}

// ---------------------------------------------------------------------------------------------

export function formatFault(r: FaultReport): string {
  const pass = r.checks.filter((c) => c.pass).length;
  return [
    `Fault: ${r.name} - ${pass}/${r.checks.length} checks pass`,
    `Tried: ${r.tried}`,
    "",
    markdownTable(
      ["figure", "value"],
      r.figures.map(([k, v]) => [k, v]),
    ),
    "",
    markdownTable(
      ["check", "expected", "got", "result"],
      r.checks.map((c) => [c.check, c.expected, c.got, c.pass ? "pass" : "FAIL"]),
    ),
  ].join("\n");
}

export async function runFaults(
  argv: readonly string[],
  log = console.error,
): Promise<FaultReport[]> {
  const only = (flag(argv, "only") ?? "crash,duplicates,slow,fuzz").split(",");
  const out: FaultReport[] = [];
  const run = async (name: string, fn: () => Promise<FaultReport>) => {
    if (!only.includes(name)) return;
    log(`faults: ${name}`);
    try {
      out.push(await fn());
    } catch (error) {
      out.push({
        name,
        tried: "the run itself failed",
        figures: [],
        checks: [
          check(
            "run completed",
            "no error",
            String(error instanceof Error ? error.message : error).slice(0, 300),
            false,
          ),
        ],
      });
    }
  };
  await run("crash", () =>
    crashRun({ sessions: intFlag(argv, "crash-sessions", 10, 1), seats: 8 }),
  );
  await run("duplicates", () => duplicatesRun());
  await run("slow", () => slowRun({ slow: intFlag(argv, "slow", 50, 1), rounds: 10 }));
  await run("fuzz", () =>
    fuzzRun({
      messages: intFlag(argv, "fuzz", 10_000, 1),
      connections: 60,
      seed: intFlag(argv, "seed", 7, 0),
    }),
  );
  return out;
}

async function main() {
  const argv = process.argv.slice(2);
  const reports = await runFaults(argv);
  if (hasFlag(argv, "json")) console.log(JSON.stringify(reports, null, 2));
  else console.log(reports.map(formatFault).join("\n\n"));
  process.exit(0);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  main().catch((error: unknown) => {
    console.error(error);
    process.exit(1);
  });
}

export type { Child };
