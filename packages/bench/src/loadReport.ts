/**
 * The load run's report: its shape, the latency target, and its text (figures, reveal p99 by
 * round, targets).
 */
import { benchDatabase, serverNodeFlags } from "./child";
import type { DriveResult } from "./drive";
import { ratio } from "./stats";
import { markdownTable } from "./table";
import type { Cell } from "./table";

/** The issue's latency target for close -> reveal at the 99th percentile. */
export const REVEAL_P99_TARGET_MS = 100;
/** ours at most this many times the durable baseline (reveal p99, server CPU per move) */
export const DURABLE_RATIO_TARGET = 1.5;

export interface LoadConfig {
  sessions: number;
  seats: number;
  /** measured rounds */
  rounds: number;
  /**
   * rounds played before them by the same clients and reported apart: without one, the first
   * round after start-up is also V8's warm-up of the driving process, which runs the real
   * server's load first and the bare baseline's second, so only ours would pay it
   */
  warmupRounds: number;
  spreadMs: number;
  closeMode: "all-sealed" | "mixed";
  /** the servers' progress window (PROGRESS_PUSH_MS); 0 pushes every seal to everyone at once */
  progressMs: number;
  /**
   * the real server's window while its event loop is near full (PROGRESS_PUSH_BUSY_MS); the
   * bare baseline keeps progressMs, which is what the same rule gives on its idle loop
   */
  progressBusyMs: number;
  bare: boolean;
  /** the real server's WORKERS (>1 needs BENCH_DATABASE_URL) */
  workers: number;
}

export interface LoadReport {
  config: LoadConfig;
  loadBefore: string;
  loadAfter: string;
  /** the fixed work of speedCheckMs before and after the run (ms; lower is faster) */
  speedCheckMs: { before: number; after: number };
  serverStartRssMiB: number;
  ours: Omit<DriveResult, "acked">;
  /** the bare socket.io echo: no engine, no database */
  bare: Omit<DriveResult, "acked"> | null;
  /** the bare server storing each command with one INSERT before acking (PostgreSQL only) */
  durable: Omit<DriveResult, "acked"> | null;
  createSeconds: number;
  lostMoves: number;
  checkedMoves: number;
  exportFailures: number;
  /** sessions whose drain closeRound failed other than with wrong-state */
  drainFailures: number;
  /** warn/error lines in the server's log during the run */
  serverProblems: { count: number; last: string[] };
  targets: Array<{ target: string; measured: string; pass: boolean | null }>;
}

function byRound(d: Omit<DriveResult, "acked">): string {
  return d.revealByRound
    .map((s, i) => (i < d.warmup.rounds ? `[${s.p99.toFixed(1)}]` : s.p99.toFixed(1)))
    .join(" ");
}

export function formatLoad(r: LoadReport): string {
  const c = r.config;
  const rows: Array<[string, (d: Omit<DriveResult, "acked">) => Cell]> = [
    ["seats connected", (d) => `${d.seatsConnected} / ${d.seatsPlanned}`],
    ["facilitators connected", (d) => d.facilitatorsConnected],
    ["connect + hello, all clients (s)", (d) => d.connectSeconds],
    ["rounds phase (s)", (d) => d.roundsSeconds],
    ["moves acked", (d) => d.movesAcked],
    ["move errors", (d) => JSON.stringify(d.moveErrors)],
    ["moves per second", (d) => d.movesPerSecond],
    ["move -> ack p50 (ms)", (d) => d.ack.p50],
    ["move -> ack p99 (ms)", (d) => d.ack.p99],
    ["move -> ack max (ms)", (d) => d.ack.max],
    ["close -> reveal p50 (ms)", (d) => d.reveal.p50],
    ["close -> reveal p99 (ms)", (d) => d.reveal.p99],
    ["close -> reveal max (ms)", (d) => d.reveal.max],
    ["reveals missing (120 s)", (d) => d.revealMissing],
    ["views received per seat", (d) => d.viewsPerSeat],
    ["connections dropped", (d) => JSON.stringify(d.disconnects)],
    ["server CPU in rounds (s)", (d) => d.serverCpuSeconds],
    ["server CPU (% of one core)", (d) => d.serverCpuPercent],
    ["server CPU per move (ms)", (d) => d.serverCpuMsPerMove],
    ["server main thread CPU (% of one core)", (d) => d.serverMainThreadCpuPercent],
    ["server main thread CPU per move (ms)", (d) => d.serverMainThreadCpuMsPerMove],
    ["client event-loop delay p99 (ms)", (d) => d.clientLoopDelay.p99],
    ["client event-loop delay max (ms)", (d) => d.clientLoopDelay.max],
    ["client CPU in rounds (s)", (d) => d.clientCpuSeconds],
    ["client CPU (% of one core)", (d) => d.clientCpuPercent],
    ["server RSS after connect (MiB)", (d) => d.serverRssAfterConnectMiB],
    ["server RSS at end (MiB)", (d) => d.serverRssEndMiB],
    ["server RSS peak (MiB)", (d) => d.serverRssPeakMiB],
    ["warm-up: move -> ack p99 (ms)", (d) => (d.warmup.rounds > 0 ? d.warmup.ack.p99 : "-")],
    ["warm-up: close -> reveal p99 (ms)", (d) => (d.warmup.rounds > 0 ? d.warmup.reveal.p99 : "-")],
    ["warm-up: server CPU (s)", (d) => (d.warmup.rounds > 0 ? d.warmup.serverCpuSeconds : "-")],
    ["warm-up: client CPU (s)", (d) => (d.warmup.rounds > 0 ? d.warmup.clientCpuSeconds : "-")],
  ];
  const q = (a: Cell, b: Cell | null) => {
    const v = typeof a === "number" && typeof b === "number" ? ratio(a, b) : null;
    return v === null ? "" : Number.isNaN(v) ? "n/a" : v.toFixed(2);
  };
  const table = markdownTable(
    ["figure", "contend server", "durable baseline", "ours / durable", "bare echo", "ours / echo"],
    rows.map(([name, get]) => {
      const a = get(r.ours);
      const d = r.durable ? get(r.durable) : null;
      const b = r.bare ? get(r.bare) : null;
      return [name, a, d, q(a, d), b, q(a, b)];
    }),
  );
  const perSession = (r.ours.serverRssPeakMiB - r.serverStartRssMiB) / c.sessions;
  const targets = markdownTable(
    ["target", "measured", "result"],
    r.targets.map((t) => [
      t.target,
      t.measured,
      t.pass === null ? "not tested at this size" : t.pass ? "pass" : "MISS",
    ]),
  );
  return [
    `Load: ${c.sessions} sessions x ${c.seats} human seats (+1 facilitator each), ${c.rounds} measured rounds,`,
    `the server with ${c.workers} process${c.workers > 1 ? "es (WORKERS; CPU and RSS summed over them)" : ""},`,
    `after ${c.warmupRounds} warm-up round(s) (played the same way, figures in the "warm-up" rows only),`,
    `seals spread over ${c.spreadMs} ms after each opening, close mode ${c.closeMode}`,
    `(even rounds closed by the facilitator with one seat missing), progress window ${c.progressMs} ms,`,
    `up to ${Math.max(c.progressMs, c.progressBusyMs)} ms while the server's event loop is near full (other seats see a seal`,
    `within it). Load average before ${r.loadBefore}, after ${r.loadAfter}. Speed check (fixed work,`,
    `lower is faster): ${r.speedCheckMs.before.toFixed(1)} ms before, ${r.speedCheckMs.after.toFixed(1)} ms after.`,
    `Database: ${benchDatabase().replace(/\/\/[^@/]*@/, "//")}. Node flags of both servers: ${serverNodeFlags().join(" ") || "none"}.`,
    `Sessions created over REST in ${r.createSeconds.toFixed(1)} s. Server RSS at start ${r.serverStartRssMiB.toFixed(1)} MiB;`,
    `peak RSS growth per session ${perSession.toFixed(2)} MiB. ${r.checkedMoves} acked moves checked against the exported logs`,
    `after a drain (${r.drainFailures} drain failures): ${r.lostMoves} lost.`,
    `Server log: ${r.serverProblems.count} warn/error lines${r.serverProblems.count ? `; last: ${r.serverProblems.last.join(" | ")}` : ""}.`,
    `Close -> reveal p99 by round (ms, warm-up in brackets): ours ${byRound(r.ours)}${r.durable ? `; durable ${byRound(r.durable)}` : ""}${r.bare ? `; echo ${byRound(r.bare)}` : ""}.`,
    "",
    table,
    "",
    targets,
  ].join("\n");
}
