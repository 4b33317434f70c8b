/**
 * Fault 1, crash: SIGKILL while seats are sealing, restart on the same data directory,
 * reconnect; every acknowledged move must be there.
 */
import { createSession, exportEvents, kioskScenario, missingMoves } from "../api";
import type { AckedMove, ExportedEvent } from "../api";
import { inBatches, sleep } from "../client";
import { check, closeTable, newServer, playRound, seatTable } from "./common";
import type { FaultReport, Table } from "./common";

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
