/** REST calls to the real server, all bounded by a timeout. */

export interface CreatedSession {
  id: string;
  facilitatorKey: string;
  seats: Array<{ index: number; kind: string; key: string | null }>;
}

export interface ExportedEvent {
  seq: number;
  type: string;
  round?: number;
  seatIndex?: number;
  clientMoveId?: string;
  effort?: number;
  [field: string]: unknown;
}

/** An invented scenario: `seats` bakeries bidding for a station kiosk lease, all human seats. */
export function kioskScenario(seats: number, rounds: number) {
  return {
    title: `Kiosk lease, ${seats} bakeries`,
    prize: 1000,
    csf: { kind: "ratio", decisiveness: 1 },
    currency: "$",
    rivals: Array.from({ length: seats }, (_, i) => ({
      name: `Bakery ${i + 1}`,
      cost: 1 + (i % 3) / 4,
    })),
    leader: null,
    session: { outcome: "shares", effortStep: 1, rounds, clockSeconds: null, missingMove: "zero" },
  };
}

export async function createSession(base: string, body: unknown): Promise<CreatedSession> {
  const res = await fetch(`${base}/api/sessions`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(body),
    signal: AbortSignal.timeout(30_000),
  });
  if (res.status !== 201) throw new Error(`POST /api/sessions: ${res.status} ${await res.text()}`);
  return (await res.json()) as CreatedSession;
}

/**
 * The operator key every benchmark server is started with (child.ts): it exports any session.
 * A bench-only value for servers on loopback that live for one run.
 */
export const BENCH_OPERATOR_KEY = "bench-operator-key-for-loopback-runs-only";

export async function exportEvents(base: string, id: string): Promise<ExportedEvent[]> {
  const res = await fetch(`${base}/api/sessions/${encodeURIComponent(id)}/export`, {
    headers: { authorization: `Bearer ${BENCH_OPERATOR_KEY}` },
    signal: AbortSignal.timeout(30_000),
  });
  if (!res.ok) throw new Error(`export ${id}: ${res.status} ${await res.text()}`);
  const body = (await res.json()) as { events: ExportedEvent[] };
  return body.events;
}

export async function healthy(base: string): Promise<boolean> {
  try {
    const res = await fetch(`${base}/api/health`, { signal: AbortSignal.timeout(5000) });
    return res.ok && ((await res.json()) as { ok?: boolean }).ok === true;
  } catch {
    return false;
  }
}

export interface AckedMove {
  sessionId: string;
  round: number;
  seatIndex: number;
  clientMoveId: string;
  effort: number;
}

/** Acked moves with no matching move-sealed event in their session's log. */
export function missingMoves(
  acked: readonly AckedMove[],
  logs: ReadonlyMap<string, readonly ExportedEvent[]>,
): AckedMove[] {
  const present = new Set<string>();
  for (const [sessionId, events] of logs) {
    for (const e of events) {
      if (e.type === "move-sealed") {
        present.add(`${sessionId}|${e.round}|${e.seatIndex}|${e.clientMoveId}|${e.effort}`);
      }
    }
  }
  return acked.filter(
    (m) => !present.has(`${m.sessionId}|${m.round}|${m.seatIndex}|${m.clientMoveId}|${m.effort}`),
  );
}
