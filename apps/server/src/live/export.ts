/**
 * Session exports. Everything is computed from one read of the event log, so the record is
 * consistent with itself. Events of a round that is still open are left out: its sealed moves
 * stay private until the round resolves.
 */
import type { SessionSummary } from "@contend/db";
import type {
  RoundResult,
  SessionEvent,
  SessionExport,
  SessionListItem,
  ShockRecord,
} from "@contend/protocol";
import { toCsv } from "@contend/protocol";
import type { CsvCell } from "@contend/protocol";
import { fold, shockText, WITHHELD_UNTIL_END, withholdSecrets } from "@contend/session";

/** The log without the open round: cut at the last round-opened that has no round-resolved. */
export function publicEvents(events: readonly SessionEvent[]): SessionEvent[] {
  let cut = events.length;
  for (let i = events.length - 1; i >= 0; i--) {
    const e = events[i]!;
    if (e.type === "round-resolved") break;
    if (e.type === "round-opened") {
      cut = i;
      break;
    }
  }
  return events.slice(0, cut);
}

export function listItem(
  summary: SessionSummary,
  rounds: number,
  endedAt: number | null,
): SessionListItem {
  return {
    id: summary.id,
    title: summary.title,
    status: summary.status as SessionListItem["status"],
    createdAt: summary.createdAt.toISOString(),
    updatedAt: summary.updatedAt.toISOString(),
    rounds,
    tags: summary.tags,
    archivedAt: summary.archivedAt?.toISOString() ?? null,
    endedAt: endedAt === null ? null : new Date(endedAt).toISOString(),
  };
}

/**
 * The export of a session: the log without the open round; before the session has ended, also
 * without computer policies and seeds (R23, `withholdSecrets`), and `withheld` says so.
 */
export function buildExport(
  summary: SessionSummary,
  allEvents: readonly SessionEvent[],
): SessionExport {
  const ended = allEvents.some((e) => e.type === "session-ended");
  const cut = publicEvents(allEvents);
  const events = ended ? cut : withholdSecrets(cut);
  const state = fold(events);
  const rounds: RoundResult[] = state.status === "empty" ? [] : state.rounds;
  const shocks = state.status === "empty" ? [] : state.shocks;
  const record: SessionExport = {
    session: listItem(
      summary,
      rounds.length,
      allEvents.find((e) => e.type === "session-ended")?.at ?? null,
    ),
    events,
    rounds,
    shocks,
  };
  if (!ended) record.withheld = [...WITHHELD_UNTIL_END];
  return record;
}

export const CSV_HEADER = [
  "round",
  "seat",
  "rival",
  "spend",
  "effort",
  "share",
  "payoff",
  "total",
  "bestResponseSpend",
  "bestResponse",
  "regret",
  "equilibriumSpend",
  "equilibriumEffort",
  "defaulted",
  "reason",
  "changesBefore",
  "moveReason",
  "roundNote",
] as const;

/** Sessions with fronts (R48): per-front columns `<what>:<front name>` after CSV_HEADER. */
export const FRONT_CSV_COLUMNS = ["spend", "share", "bestResponseSpend", "equilibriumSpend"];

/** The fronts' names of a session's log, in file order ([] for a single contest). */
export function frontNamesOf(events: readonly SessionEvent[]): string[] {
  const created = events.find((e) => e.type === "session-created");
  if (!created || !("fronts" in created.scenario)) return [];
  return created.scenario.fronts.map((f) => f.name);
}

/**
 * One row per seat that played, per resolved round; `changesBefore` lists the shocks applied
 * since the previous round (money in the session's units, as the scenario states them). With
 * fronts (`frontNames` given) each row also has the seat's money, share, best reply and
 * equilibrium money on every front; the columns above are then its totals (R48).
 */
export function roundsCsv(
  rounds: readonly RoundResult[],
  shocks: readonly ShockRecord[] = [],
  frontNames: readonly string[] = [],
): string {
  const header = [
    ...CSV_HEADER,
    ...FRONT_CSV_COLUMNS.flatMap((c) => frontNames.map((name) => `${c}:${name}`)),
  ];
  const rows: CsvCell[][] = [];
  for (const r of rounds) {
    const changes = shocks
      .filter((s) => s.afterRound === r.round - 1)
      .map(shockText)
      .join("; ");
    const eq = r.equilibrium;
    const eqEfforts = eq.efforts ?? eq.expectedEfforts ?? null;
    r.seatIndices.forEach((seat, k) => {
      rows.push([
        r.round,
        seat,
        r.scenario.rivals[k]?.name ?? "",
        r.spends[seat] ?? null,
        r.efforts[seat] ?? null,
        r.shares[seat] ?? null,
        r.payoffs[seat] ?? null,
        r.totals[seat] ?? null,
        r.bestResponseSpends[seat] ?? null,
        r.bestResponses[seat] ?? null,
        r.regrets[seat] ?? null,
        r.equilibriumSpends[seat] ?? null,
        eqEfforts ? (eqEfforts[k] ?? null) : null,
        r.defaulted[seat] ?? null,
        r.reason,
        changes,
        r.moveReasons?.[seat] ?? null,
        r.note ?? null,
        ...perFrontCells(r, seat, frontNames.length),
      ]);
    });
  }
  return toCsv(header, rows);
}

function perFrontCells(r: RoundResult, seat: number, fronts: number): CsvCell[] {
  if (fronts === 0) return [];
  const f = r.fronts;
  const grids = [f?.spends, f?.shares, f?.bestSpends, f?.equilibrium.spends ?? undefined];
  return grids.flatMap((g) =>
    Array.from({ length: fronts }, (_, k): CsvCell => g?.[seat]?.[k] ?? null),
  );
}
