/**
 * Fault 4: fuzzed messages; the event log must be unchanged except for legit events.
 */
import { mulberry32 as rng } from "@contend/solver";
import { isDeepStrictEqual } from "node:util";
import { createSession, exportEvents, healthy, kioskScenario, missingMoves } from "../api";
import type { AckedMove, ExportedEvent } from "../api";
import { sleep } from "../client";
import type { AckLike } from "../client";
import { RawClient } from "../raw";
import type { Cell } from "../table";
import { check, closeTable, newServer, playRound, seatTable } from "./common";
import type { Check, FaultReport } from "./common";

import { fuzzHello, fuzzPacket } from "./fuzzPackets";

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
