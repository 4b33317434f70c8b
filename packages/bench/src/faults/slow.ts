/**
 * Fault 3: slow clients that stop reading their socket.
 */
import { createSession, exportEvents, healthy, kioskScenario, missingMoves } from "../api";
import type { AckedMove } from "../api";
import { SessionClient } from "../client";
import type { AckLike } from "../client";
import { RawClient } from "../raw";
import { rssMiB } from "../proc";
import { summarize } from "../stats";
import { check, closeTable, newServer, playRound, seatTable } from "./common";
import type { FaultReport } from "./common";

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
