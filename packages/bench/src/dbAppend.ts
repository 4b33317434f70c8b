/**
 * The database alone: how long one event-log append (the commit behind every ack) takes on
 * embedded PGlite in a fresh directory, without sockets, engine or solver. One writer appending
 * to one session back to back, the same with the appends spaced out (its appends/s is the
 * offered rate, its CPU includes the idle timers), then many sessions appending at once (each
 * session serial, as the server's queues are). The database runs on its own thread of this
 * process, as in the server; CPU is this process's, both threads.
 *   npx tsx src/dbAppend.ts [--appends 400] [--sessions 40] [--json]
 */
import path from "node:path";
import { fileURLToPath } from "node:url";
import { openDatabase } from "@contend/db";
import type { Database } from "@contend/db";
import { inBatches, sleep } from "./client";
import { tempDir } from "./child";
import { hasFlag, intFlag } from "./flags";
import { loadAverage, selfCpuSeconds } from "./proc";
import { summarize } from "./stats";
import type { Summary } from "./stats";
import { markdownTable } from "./table";

export interface AppendFigures {
  case: string;
  appends: number;
  seconds: number;
  perSecond: number;
  ms: Summary;
  cpuMsPerAppend: number;
  /** longest gap between ticks of a 5 ms timer (ms): how long sockets and pings would wait */
  loopDelayMaxMs: number;
}

async function newSession(db: Database, n: number): Promise<string> {
  const id = `bench-${n}-${Math.random().toString(36).slice(2, 10)}`;
  const result = await db.sessions.create({
    id,
    joinCode: `B${n}${Math.random().toString(36).slice(2, 6)}`.toUpperCase().slice(0, 8),
    title: "append bench",
    scenario: { title: "append bench" },
    seats: [{ index: 0, name: "Bakery 1", kind: "human" }],
    keys: [{ role: "facilitator", seatIndex: null, plaintext: `key-${id}` }],
    firstEvent: { type: "session-created", at: Date.now(), payload: { note: "bench" } },
  });
  if (!result.ok) throw new Error(`could not create a bench session: ${JSON.stringify(result)}`);
  return id;
}

/** a move-sealed-sized payload */
const payload = (k: number) => ({
  round: 1,
  seatIndex: 0,
  effort: 10 + (k % 50),
  clientMoveId: `bench-move-${k}`,
  by: "seat",
});

/** gapMs: idle time before each append (only the append itself is timed) */
async function appendMany(db: Database, id: string, count: number, ms: number[], gapMs = 0) {
  let seq = 1;
  for (let k = 0; k < count; k++) {
    if (gapMs > 0) await sleep(gapMs);
    const t0 = performance.now();
    const r = await db.events.append(id, seq, [
      { type: "move-sealed", at: Date.now(), payload: payload(k) },
    ]);
    ms.push(performance.now() - t0);
    if (!r.ok) throw new Error(`append refused: ${JSON.stringify(r)}`);
    seq++;
  }
}

const SPACED_GAP_MS = 5;

async function measure(name: string, appends: number, run: (ms: number[]) => Promise<void>) {
  const ms: number[] = [];
  // the longest gap between ticks of a 5 ms timer = how long the loop was held up
  let lastTick = performance.now();
  let longestGap = 0;
  const ticker = setInterval(() => {
    const now = performance.now();
    longestGap = Math.max(longestGap, now - lastTick);
    lastTick = now;
  }, 5);
  const cpu0 = selfCpuSeconds();
  const t0 = performance.now();
  await run(ms);
  const seconds = (performance.now() - t0) / 1000;
  clearInterval(ticker);
  // a timer that never got to run counts up to the end
  longestGap = Math.max(longestGap, performance.now() - lastTick);
  return {
    case: name,
    appends,
    seconds,
    perSecond: appends / seconds,
    ms: summarize(ms),
    cpuMsPerAppend: ((selfCpuSeconds() - cpu0) * 1000) / appends,
    loopDelayMaxMs: longestGap,
  };
}

export async function runDbAppend(opts: {
  appends: number;
  sessions: number;
}): Promise<AppendFigures[]> {
  const dir = tempDir("contend-db-bench-");
  const db = await openDatabase({ url: path.join(dir, "pglite") });
  try {
    const warm = await newSession(db, 0);
    await appendMany(db, warm, 20, []);
    const one = await newSession(db, 1);
    const serial = await measure("one session, one append at a time", opts.appends, (ms) =>
      appendMany(db, one, opts.appends, ms),
    );
    // The same appends spaced out, as a lightly loaded server makes them: on the VM these
    // figures were taken on, one statement cost 2-4x more after a few ms of idle (or of
    // unrelated work) than back to back, so the case above understates a quiet server's cost.
    const spacedCount = Math.min(opts.appends, 200);
    const spaced = await newSession(db, 2);
    const idle = await measure(
      `one session, one append every ${SPACED_GAP_MS} ms (idle between)`,
      spacedCount,
      (ms) => appendMany(db, spaced, spacedCount, ms, SPACED_GAP_MS),
    );
    const ids: string[] = [];
    for (let i = 0; i < opts.sessions; i++) ids.push(await newSession(db, 10 + i));
    const per = Math.max(1, Math.floor(opts.appends / opts.sessions));
    const parallel = await measure(
      `${opts.sessions} sessions appending at once (${per} each)`,
      per * opts.sessions,
      (ms) => inBatches(ids, ids.length, (id) => appendMany(db, id, per, ms)).then(() => undefined),
    );
    return [serial, idle, parallel];
  } finally {
    await db.close();
  }
}

export function formatDbAppend(rows: AppendFigures[]): string {
  return markdownTable(
    [
      "database append (PGlite on its own thread)",
      "appends",
      "appends/s",
      "p50 ms",
      "p99 ms",
      "max ms",
      "CPU ms/append",
      "longest timer gap ms",
    ],
    rows.map((r) => [
      r.case,
      r.appends,
      r.perSecond,
      r.ms.p50,
      r.ms.p99,
      r.ms.max,
      r.cpuMsPerAppend,
      r.loopDelayMaxMs,
    ]),
  );
}

async function main() {
  const argv = process.argv.slice(2);
  const rows = await runDbAppend({
    appends: intFlag(argv, "appends", 400, 1),
    sessions: intFlag(argv, "sessions", 40, 1),
  });
  if (hasFlag(argv, "json")) console.log(JSON.stringify(rows, null, 2));
  else console.log(`${formatDbAppend(rows)}\n\nload average ${loadAverage()}`);
  process.exit(0);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  main().catch((error: unknown) => {
    console.error(error);
    process.exit(1);
  });
}
