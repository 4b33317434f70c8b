/**
 * What every fault run shares: the report shape, a seated table of socket clients, playing a
 * round, and a fresh real server.
 */
import type { AckedMove, CreatedSession } from "../api";
import { freePort, startServer, tempDir } from "../child";
import { SessionClient } from "../client";
import type { Cell } from "../table";

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

export const check = (name: string, expected: string, got: Cell, pass: boolean): Check => ({
  check: name,
  expected,
  got: typeof got === "string" ? got : String(got),
  pass,
});

export interface Table {
  created: CreatedSession;
  facilitator: SessionClient;
  seats: SessionClient[];
}

export async function seatTable(
  url: string,
  created: CreatedSession,
  reconnect = false,
): Promise<Table> {
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

export function closeTable(t: Table) {
  for (const c of [t.facilitator, ...t.seats]) c.close();
}

/** Opens round `round`, seals every seat, waits for the resolved view. */
export async function playRound(t: Table, round: number, acked: AckedMove[]): Promise<boolean> {
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

export async function newServer(dataDir?: string, port?: number, env?: Record<string, string>) {
  const dir = dataDir ?? tempDir("contend-faults-");
  const p = port ?? (await freePort());
  return { server: await startServer({ dataDir: dir, port: p, env }), dataDir: dir, port: p };
}
