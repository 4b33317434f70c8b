/**
 * The load driver shared by the real server and the bare baseline: connect every facilitator
 * and seat, then play rounds in all sessions at once. Every wait is bounded; a missing ack or
 * view is counted, never waited for forever.
 */
import { monitorEventLoopDelay } from "node:perf_hooks";
import { mulberry32 } from "@contend/solver";
import { inBatches, SessionClient, sleep } from "./client";
import type { AckedMove } from "./api";
// The server's CPU and memory count its worker processes too (WORKERS=N); alone, the same.
import { mainThreadCpuSeconds, selfCpuSeconds, treeCpuSeconds, treeRssMiB } from "./proc";
import { summarize } from "./stats";
import type { Summary } from "./stats";

export interface SessionPlan {
  id: string;
  facilitatorKey: string;
  seatKeys: string[];
}

export interface DriveOptions {
  url: string;
  serverPid: number;
  sessions: SessionPlan[];
  /** measured rounds, played after the warm-up rounds */
  rounds: number;
  /**
   * rounds played first and reported apart (default 0): the first round after start-up runs
   * while V8 is still compiling the hot paths of the server and of this driving process
   */
  warmupRounds?: number;
  /** each seat seals after a uniform random delay in [0, spreadMs] from the round opening */
  spreadMs: number;
  /** "mixed": even rounds are closed by the facilitator with the last seat not sealing */
  closeMode: "all-sealed" | "mixed";
  connectConcurrency: number;
  /** record the size of views received by the first session's clients */
  sampleViews?: boolean;
  seed?: number;
  /** how long to wait for an ack or a reveal before counting it missing (default 120 s) */
  timeoutMs?: number;
}

export interface WarmupResult {
  rounds: number;
  ack: Summary;
  reveal: Summary;
  serverCpuSeconds: number;
  clientCpuSeconds: number;
}

export interface DriveResult {
  sessions: number;
  seatsPlanned: number;
  seatsConnected: number;
  facilitatorsConnected: number;
  connectSeconds: number;
  roundsSeconds: number;
  movesAcked: number;
  moveErrors: Record<string, number>;
  movesPerSecond: number;
  ack: Summary;
  reveal: Summary;
  revealMissing: number;
  serverCpuSeconds: number;
  serverCpuPercent: number;
  serverCpuMsPerMove: number;
  /** the server's main thread (event loop) alone, % of one core */
  serverMainThreadCpuPercent: number;
  /** the main thread's share of serverCpuMsPerMove: what limits a server whose other cores are free */
  serverMainThreadCpuMsPerMove: number;
  /**
   * how late the driving process's own event loop ran (ms) during the rounds: time that every
   * latency above includes on the client side, since all clients share that one loop
   */
  clientLoopDelay: { p50: number; p99: number; max: number };
  clientCpuSeconds: number;
  clientCpuPercent: number;
  serverRssAfterConnectMiB: number;
  serverRssEndMiB: number;
  /** highest RSS sampled every 250 ms from connecting to the end */
  serverRssPeakMiB: number;
  viewsPerSeat: number;
  /** connections dropped during the run, by reason (clients do not reconnect in load runs) */
  disconnects: Record<string, number>;
  meanViewBytes: number;
  /** the warm-up rounds' own figures, not included in any of the above */
  warmup: WarmupResult;
  /** close -> reveal of each round on its own, warm-up rounds first (a slow round shows here) */
  revealByRound: Summary[];
  /** every acknowledged move, warm-up rounds included (all must survive) */
  acked: AckedMove[];
}

// Seeded draws (the solver's mulberry32), so reruns draw the same values.
const rng = mulberry32;

interface Live {
  plan: SessionPlan;
  facilitator: SessionClient;
  seats: SessionClient[];
}

export async function drive(opts: DriveOptions): Promise<DriveResult> {
  const random = rng(opts.seed ?? 1);
  const timeoutMs = opts.timeoutMs ?? 120_000;
  const lives: Live[] = opts.sessions.map((plan) => ({
    plan,
    facilitator: new SessionClient({
      url: opts.url,
      credentials: { role: "facilitator", sessionId: plan.id, key: plan.facilitatorKey },
      ackTimeoutMs: timeoutMs,
    }),
    seats: plan.seatKeys.map(
      (key) =>
        new SessionClient({
          url: opts.url,
          credentials: { role: "seat", sessionId: plan.id, key },
          ackTimeoutMs: timeoutMs,
        }),
    ),
  }));
  if (opts.sampleViews && lives[0]) {
    for (const c of [lives[0].facilitator, ...lives[0].seats]) c.sampleViewSizes();
  }

  let serverRssPeakMiB = treeRssMiB(opts.serverPid) ?? Number.NaN;
  const rssSampler = setInterval(() => {
    const now = treeRssMiB(opts.serverPid);
    if (now !== null && !(now <= serverRssPeakMiB)) serverRssPeakMiB = now;
  }, 250);
  const t0 = performance.now();
  const all = lives.flatMap((l) => [l.facilitator, ...l.seats]);
  const helloOk = new Set<SessionClient>();
  await inBatches(all, opts.connectConcurrency, async (client) => {
    try {
      await client.connect();
      const ack = await client.hello();
      if (ack.ok) helloOk.add(client);
    } catch {
      // counted below as not connected
    }
  });
  const connectSeconds = (performance.now() - t0) / 1000;
  const seatsConnected = lives.reduce(
    (n, l) => n + l.seats.filter((s) => helloOk.has(s)).length,
    0,
  );
  const facilitatorsConnected = lives.filter((l) => helloOk.has(l.facilitator)).length;
  const serverRssAfterConnectMiB = treeRssMiB(opts.serverPid) ?? Number.NaN;

  const warmupRounds = opts.warmupRounds ?? 0;
  const ackMs: number[] = [];
  const revealMs: number[] = [];
  const warmAckMs: number[] = [];
  const warmRevealMs: number[] = [];
  const byRound: number[][] = [];
  let movesAcked = 0;
  const moveErrors: Record<string, number> = {};
  const acked: AckedMove[] = [];
  let revealMissing = 0;
  const countError = (code: string | undefined) => {
    const k = code ?? "unknown";
    moveErrors[k] = (moveErrors[k] ?? 0) + 1;
  };

  const warmServer0 = treeCpuSeconds(opts.serverPid) ?? Number.NaN;
  const warmClient0 = selfCpuSeconds();
  let cpuServer0 = warmServer0;
  let cpuMain0 = mainThreadCpuSeconds(opts.serverPid) ?? Number.NaN;
  let cpuClient0 = warmClient0;
  const loopDelay = monitorEventLoopDelay({ resolution: 5 });
  const seatClients = lives.flatMap((l) => l.seats);
  let viewsBefore = 0;
  let tRounds = performance.now();
  for (let round = 1; round <= warmupRounds + opts.rounds; round++) {
    const measured = round > warmupRounds;
    if (round === warmupRounds + 1) {
      // The measured rounds start here: everything below counts from this point.
      cpuServer0 = treeCpuSeconds(opts.serverPid) ?? Number.NaN;
      cpuMain0 = mainThreadCpuSeconds(opts.serverPid) ?? Number.NaN;
      cpuClient0 = selfCpuSeconds();
      viewsBefore = seatClients.reduce((n, c) => n + c.viewsReceived, 0);
      loopDelay.enable();
      tRounds = performance.now();
    }
    const acks = measured ? ackMs : warmAckMs;
    const reveals = measured ? revealMs : warmRevealMs;
    const thisRound: number[] = [];
    byRound.push(thisRound);
    await Promise.all(
      lives.map(async (live, sessionIndex) => {
        const watchers = [live.facilitator, ...live.seats].filter((c) => helloOk.has(c));
        const viewed = watchers.map((c) =>
          c.waitForView((v) => v.rounds.length >= round, timeoutMs),
        );
        const opened = await live.facilitator.command({ type: "openRound", durationSeconds: null });
        if (!opened.ok) {
          countError(`openRound:${opened.code}`);
          return;
        }
        const byFacilitator = opts.closeMode === "mixed" && round % 2 === 0;
        const sealers = live.seats.filter(
          (s, i) => helloOk.has(s) && !(byFacilitator && i === live.seats.length - 1),
        );
        let lastEmit = 0;
        await Promise.all(
          sealers.map(async (seat) => {
            const seatIndex = live.seats.indexOf(seat);
            const delay = random() * opts.spreadMs;
            const effort = 10 + Math.floor(random() * 200);
            const clientMoveId = `r${round}-x${sessionIndex}-s${seatIndex}-${Math.floor(random() * 1e9)}`;
            if (delay > 0) await sleep(delay);
            const sent = performance.now();
            lastEmit = Math.max(lastEmit, sent);
            const ack = await seat.command({ type: "sealMove", clientMoveId, effort, round });
            if (ack.ok) {
              acks.push(performance.now() - sent);
              acked.push({ sessionId: live.plan.id, round, seatIndex, clientMoveId, effort });
              if (measured) movesAcked++;
            } else countError(ack.code);
          }),
        );
        let closedAt = lastEmit;
        if (byFacilitator) {
          closedAt = performance.now();
          const closed = await live.facilitator.command({ type: "closeRound" });
          if (!closed.ok) countError(`closeRound:${closed.code}`);
        }
        for (const at of await Promise.all(viewed)) {
          if (at === null) revealMissing++;
          else {
            reveals.push(Math.max(0, at - closedAt));
            thisRound.push(Math.max(0, at - closedAt));
          }
        }
      }),
    );
  }
  const roundsSeconds = (performance.now() - tRounds) / 1000;
  const warmup: WarmupResult = {
    rounds: warmupRounds,
    ack: summarize(warmAckMs),
    reveal: summarize(warmRevealMs),
    serverCpuSeconds: cpuServer0 - warmServer0,
    clientCpuSeconds: cpuClient0 - warmClient0,
  };
  const serverCpuSeconds = (treeCpuSeconds(opts.serverPid) ?? Number.NaN) - cpuServer0;
  const mainCpuSeconds = (mainThreadCpuSeconds(opts.serverPid) ?? Number.NaN) - cpuMain0;
  const clientCpuSeconds = selfCpuSeconds() - cpuClient0;
  loopDelay.disable();
  const clientLoopDelay = {
    p50: loopDelay.percentile(50) / 1e6,
    p99: loopDelay.percentile(99) / 1e6,
    max: loopDelay.max / 1e6,
  };
  const serverRssEndMiB = treeRssMiB(opts.serverPid) ?? Number.NaN;
  clearInterval(rssSampler);

  const sampled = lives[0] ? [lives[0].facilitator, ...lives[0].seats] : [];
  const sampledViews = sampled.reduce((n, c) => n + c.viewsReceived, 0);
  const sampledBytes = sampled.reduce((n, c) => n + c.viewBytes, 0);
  const viewsPerSeat =
    (seatClients.reduce((n, c) => n + c.viewsReceived, 0) - viewsBefore) /
    Math.max(1, seatClients.length);
  const disconnects: Record<string, number> = {};
  for (const c of all) for (const r of c.disconnects) disconnects[r] = (disconnects[r] ?? 0) + 1;
  for (const c of all) c.close();

  return {
    sessions: lives.length,
    seatsPlanned: seatClients.length,
    seatsConnected,
    facilitatorsConnected,
    connectSeconds,
    roundsSeconds,
    movesAcked,
    moveErrors,
    movesPerSecond: movesAcked / roundsSeconds,
    ack: summarize(ackMs),
    reveal: summarize(revealMs),
    revealMissing,
    serverCpuSeconds,
    serverCpuPercent: (100 * serverCpuSeconds) / roundsSeconds,
    serverCpuMsPerMove: (1000 * serverCpuSeconds) / Math.max(1, movesAcked),
    serverMainThreadCpuPercent: (100 * mainCpuSeconds) / roundsSeconds,
    serverMainThreadCpuMsPerMove: (1000 * mainCpuSeconds) / Math.max(1, movesAcked),
    clientLoopDelay,
    clientCpuSeconds,
    clientCpuPercent: (100 * clientCpuSeconds) / roundsSeconds,
    serverRssAfterConnectMiB,
    serverRssEndMiB,
    serverRssPeakMiB,
    viewsPerSeat,
    disconnects,
    meanViewBytes: opts.sampleViews && sampledViews > 0 ? sampledBytes / sampledViews : Number.NaN,
    warmup,
    revealByRound: byRound.map(summarize),
    acked,
  };
}
