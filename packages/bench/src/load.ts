/**
 * Load run: the real server and a bare socket.io baseline, driven by the same clients on the
 * same machine in one run, then a check that every acknowledged move is in the event log.
 *   npx tsx src/load.ts                # quick: 20 sessions x 8 seats, 4 rounds
 *   npx tsx src/load.ts --full         # 200 sessions x 8 seats (1,600 seats)
 *   flags: --sessions K --seats S --rounds R --warmup W --spread ms --close mixed|all-sealed
 *          --progress ms --progress-busy ms --no-bare --workers N --json
 * With BENCH_DATABASE_URL (PostgreSQL) it also runs the durable baseline: the bare server
 * storing each command with one INSERT into that database and acking after the commit.
 * Prints numbers and pass/fail against the targets; asserts nothing.
 */
import { fileURLToPath } from "node:url";
import { createSession, exportEvents, kioskScenario, missingMoves } from "./api";
import type { ExportedEvent } from "./api";
import { benchDatabase, freePort, startBareServer, startServer, tempDir } from "./child";
import { inBatches, SessionClient } from "./client";
import { drive } from "./drive";
import type { DriveResult, SessionPlan } from "./drive";
import { flag, hasFlag, intFlag } from "./flags";
import { loadAverage, rssMiB } from "./proc";
import { speedCheckMs } from "./speed";
import { ratio } from "./stats";
import { DURABLE_RATIO_TARGET, formatLoad, REVEAL_P99_TARGET_MS } from "./loadReport";
import type { LoadConfig, LoadReport } from "./loadReport";

export { REVEAL_P99_TARGET_MS } from "./loadReport";
export type { LoadConfig, LoadReport } from "./loadReport";

export function configFrom(argv: readonly string[]): LoadConfig {
  const full = hasFlag(argv, "full");
  const close = flag(argv, "close") ?? "mixed";
  if (close !== "mixed" && close !== "all-sealed")
    throw new Error("--close must be mixed or all-sealed");
  return {
    sessions: intFlag(argv, "sessions", full ? 200 : 20, 1),
    seats: intFlag(argv, "seats", 8, 2),
    rounds: intFlag(argv, "rounds", 4, 1),
    warmupRounds: intFlag(argv, "warmup", 1, 0),
    spreadMs: intFlag(argv, "spread", 1000, 0),
    closeMode: close,
    progressMs: intFlag(argv, "progress", 200, 0),
    progressBusyMs: intFlag(argv, "progress-busy", 1000, 0),
    bare: !hasFlag(argv, "no-bare"),
    workers: intFlag(argv, "workers", 1, 1),
  };
}

const strip = ({ acked: _acked, ...rest }: DriveResult) => rest;

export async function runLoad(config: LoadConfig, log = console.error): Promise<LoadReport> {
  const loadBefore = loadAverage();
  const speedBefore = speedCheckMs();
  const port = await freePort();
  const server = await startServer({
    dataDir: tempDir("contend-load-"),
    port,
    env: {
      PROGRESS_PUSH_MS: String(config.progressMs),
      PROGRESS_PUSH_BUSY_MS: String(config.progressBusyMs),
      WORKERS: String(config.workers),
    },
  });
  let report: LoadReport;
  try {
    const serverStartRssMiB = rssMiB(server.pid) ?? Number.NaN;
    log(`load: server pid ${server.pid} on ${server.url}; creating ${config.sessions} sessions`);
    const tc = performance.now();
    const created = await inBatches(Array.from({ length: config.sessions }), 8, () =>
      createSession(server.url, kioskScenario(config.seats, config.warmupRounds + config.rounds)),
    );
    const createSeconds = (performance.now() - tc) / 1000;
    const plans: SessionPlan[] = created.map((c) => ({
      id: c.id,
      facilitatorKey: c.facilitatorKey,
      seatKeys: c.seats.map((s) => s.key!),
    }));
    log(`load: driving ${config.sessions * config.seats} seats through ${config.rounds} rounds`);
    const ours = await drive({
      url: server.url,
      serverPid: server.pid,
      sessions: plans,
      rounds: config.rounds,
      warmupRounds: config.warmupRounds,
      spreadMs: config.spreadMs,
      closeMode: config.closeMode,
      connectConcurrency: 32,
      sampleViews: true,
    });
    // Drain: a closeRound per session queues behind everything still pending there, so once it
    // is answered the log holds every earlier command and no round is left open (an export
    // leaves out the events of an open round).
    log("load: draining (closeRound in every session), then exporting");
    let drainFailures = 0;
    await inBatches(plans, 16, async (p) => {
      const c = new SessionClient({
        url: server.url,
        credentials: { role: "facilitator", sessionId: p.id, key: p.facilitatorKey },
        ackTimeoutMs: 180_000,
      });
      try {
        await c.connect();
        const hello = await c.hello();
        const closed = hello.ok ? await c.command({ type: "closeRound" }) : hello;
        if (!closed.ok && closed.code !== "wrong-state") drainFailures++;
      } catch {
        drainFailures++;
      } finally {
        c.close();
      }
    });
    log(`load: checking ${ours.acked.length} acked moves against the exported logs`);
    const logs = new Map<string, ExportedEvent[]>();
    let exportFailures = 0;
    await inBatches(plans, 4, async (p) => {
      try {
        logs.set(p.id, await exportEvents(server.url, p.id));
      } catch {
        exportFailures++;
      }
    });
    const lost = missingMoves(ours.acked, logs);
    const serverProblems = server.problems();
    await server.kill("SIGTERM");

    const bareRun = async (durableUrl?: string): Promise<DriveResult> => {
      const barePort = await freePort();
      const viewBytes = Number.isFinite(ours.meanViewBytes) ? Math.round(ours.meanViewBytes) : 4000;
      const bareServer = await startBareServer(barePort, {
        seats: config.seats,
        viewBytes,
        progressMs: config.progressMs,
        durableUrl,
      });
      try {
        const kind = durableUrl ? "durable (one INSERT per move)" : "echo";
        log(`load: bare socket.io ${kind} (pid ${bareServer.pid}), views of ${viewBytes} bytes`);
        return await drive({
          url: bareServer.url,
          serverPid: bareServer.pid,
          sessions: plans.map((p) => ({
            id: p.id,
            facilitatorKey: "facilitator",
            seatKeys: p.seatKeys.map((_, i) => `seat:${i}`),
          })),
          rounds: config.rounds,
          warmupRounds: config.warmupRounds,
          spreadMs: config.spreadMs,
          closeMode: config.closeMode,
          connectConcurrency: 32,
        });
      } finally {
        await bareServer.kill("SIGTERM");
      }
    };
    const onPostgres = benchDatabase().startsWith("postgres");
    const durable = config.bare && onPostgres ? await bareRun(benchDatabase()) : null;
    const bare = config.bare ? await bareRun() : null;
    const oursR = strip(ours);
    const bareR = bare ? strip(bare) : null;
    const durableR = durable ? strip(durable) : null;
    const vsDurable = (pick: (d: Omit<DriveResult, "acked">) => number) =>
      durableR ? ratio(pick(oursR), pick(durableR)) : Number.NaN;
    const durableTarget = (what: string, q: number) => ({
      target: `ours / durable baseline <= ${DURABLE_RATIO_TARGET} (${what})`,
      measured: Number.isNaN(q) ? "n/a (needs BENCH_DATABASE_URL)" : q.toFixed(2),
      pass: Number.isNaN(q) ? null : q <= DURABLE_RATIO_TARGET,
    });
    const seatsTarget = 1600;
    report = {
      config,
      loadBefore,
      loadAfter: loadAverage(),
      speedCheckMs: { before: speedBefore, after: speedCheckMs() },
      serverStartRssMiB,
      ours: oursR,
      bare: bareR,
      durable: durableR,
      createSeconds,
      lostMoves: lost.length + (exportFailures > 0 ? Number.NaN : 0),
      drainFailures,
      serverProblems,
      checkedMoves: ours.acked.length,
      exportFailures,
      targets: [
        {
          target: `${seatsTarget} connected seats`,
          measured: `${oursR.seatsConnected} of ${oursR.seatsPlanned} planned`,
          pass:
            config.sessions * config.seats < seatsTarget
              ? null
              : oursR.seatsConnected >= seatsTarget,
        },
        {
          target: `reveal p99 < ${REVEAL_P99_TARGET_MS} ms`,
          measured: `${oursR.reveal.p99.toFixed(1)} ms`,
          pass: oursR.reveal.p99 < REVEAL_P99_TARGET_MS,
        },
        durableTarget(
          "reveal p99",
          vsDurable((d) => d.reveal.p99),
        ),
        durableTarget(
          "server CPU per move",
          vsDurable((d) => d.serverCpuMsPerMove),
        ),
        {
          target: "0 acknowledged moves lost",
          measured: `${lost.length} lost of ${ours.acked.length} acked${exportFailures ? `, ${exportFailures} exports failed` : ""}`,
          pass: exportFailures === 0 && lost.length === 0,
        },
      ],
    };
  } finally {
    await server.kill("SIGKILL");
  }
  return report;
}

export { formatLoad } from "./loadReport";

async function main() {
  const argv = process.argv.slice(2);
  const report = await runLoad(configFrom(argv));
  if (hasFlag(argv, "json")) console.log(JSON.stringify(report, null, 2));
  else console.log(formatLoad(report));
  process.exit(0);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  main().catch((error: unknown) => {
    console.error(error);
    process.exit(1);
  });
}
