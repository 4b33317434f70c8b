/**
 * How far one server goes: the load run at several sizes in turn, one summary row per size,
 * and the largest size that met the reveal target.
 *   npx tsx src/capacity.ts --sizes 50,100,150,200   # sessions per run; other load flags apply
 * Each size is a whole load run (fresh server and database, bare baseline unless --no-bare).
 */
import { fileURLToPath } from "node:url";
import { flag } from "./flags";
import { configFrom, REVEAL_P99_TARGET_MS, runLoad } from "./load";
import type { LoadReport } from "./load";
import { ratio } from "./stats";
import { markdownTable } from "./table";

/** "50,100,150" -> [50, 100, 150]; refuses anything but positive integers. */
export function parseSizes(text: string): number[] {
  const sizes = text.split(",").map((s) => s.trim());
  if (sizes.length === 0 || sizes.some((s) => !/^[1-9][0-9]*$/.test(s)))
    throw new Error(
      `--sizes wants positive integers separated by commas, got ${JSON.stringify(text)}`,
    );
  return sizes.map(Number);
}

/** The most seats among runs that met the reveal target and lost nothing; null if none did. */
export function largestMeeting(rows: readonly CapacityRow[]): number | null {
  const ok = rows.filter((r) => r.revealP99 < REVEAL_P99_TARGET_MS && r.lost === 0);
  return ok.length === 0 ? null : Math.max(...ok.map((r) => r.seats));
}

export interface CapacityRow {
  sessions: number;
  seats: number;
  /** every client (seats and facilitators) connected and said hello, from the first connect */
  joinSeconds: number;
  movesPerSecond: number;
  ackP99: number;
  revealP50: number;
  revealP99: number;
  bareRevealP99: number;
  serverCpuPercent: number;
  cpuMsPerMove: number;
  lost: number;
}

export function rowOf(r: LoadReport): CapacityRow {
  return {
    sessions: r.config.sessions,
    seats: r.ours.seatsConnected,
    joinSeconds: r.ours.connectSeconds,
    movesPerSecond: r.ours.movesPerSecond,
    ackP99: r.ours.ack.p99,
    revealP50: r.ours.reveal.p50,
    revealP99: r.ours.reveal.p99,
    bareRevealP99: r.bare?.reveal.p99 ?? Number.NaN,
    serverCpuPercent: r.ours.serverCpuPercent,
    cpuMsPerMove: r.ours.serverCpuMsPerMove,
    lost: r.lostMoves,
  };
}

export function formatCapacity(rows: readonly CapacityRow[]): string {
  const best = largestMeeting(rows);
  return [
    markdownTable(
      [
        "sessions",
        "seats",
        "join (s)",
        "moves/s",
        "ack p99 (ms)",
        "reveal p50 (ms)",
        "reveal p99 (ms)",
        "bare reveal p99 (ms)",
        "reveal ours/bare",
        "server CPU (% core)",
        "CPU/move (ms)",
        "acked lost",
      ],
      rows.map((r) => {
        const q = ratio(r.revealP99, r.bareRevealP99);
        return [
          r.sessions,
          r.seats,
          r.joinSeconds,
          r.movesPerSecond,
          r.ackP99,
          r.revealP50,
          r.revealP99,
          r.bareRevealP99,
          Number.isNaN(q) ? "n/a" : q.toFixed(1),
          r.serverCpuPercent,
          r.cpuMsPerMove,
          r.lost,
        ];
      }),
    ),
    "",
    best === null
      ? `No size met reveal p99 < ${REVEAL_P99_TARGET_MS} ms with nothing lost.`
      : `Largest size meeting reveal p99 < ${REVEAL_P99_TARGET_MS} ms with nothing lost: ${best} seats.`,
  ].join("\n");
}

async function main() {
  const argv = process.argv.slice(2);
  const sizes = parseSizes(flag(argv, "sizes") || "50,100,150,200");
  const rows: CapacityRow[] = [];
  for (const [i, sessions] of sizes.entries()) {
    console.error(`capacity: size ${i + 1} of ${sizes.length}: ${sessions} sessions`);
    const report = await runLoad({ ...configFrom(argv), sessions });
    rows.push(rowOf(report));
  }
  console.log(formatCapacity(rows));
  process.exit(0);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  main().catch((error: unknown) => {
    console.error(error);
    process.exit(1);
  });
}
