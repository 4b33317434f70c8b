/**
 * Sessions side by side, from their summaries (GET /api/sessions/:id/summary, computed by
 * `summarizeSession`): rows for the by-round charts (one key per session), the marks on their
 * round axis, and the cohort CSV. Nothing is recomputed here; a figure the summary lacks belongs
 * in `summarizeSession`.
 */
import type { SessionSummaryBody, SummaryRound } from "@contend/protocol";
import { toCsv } from "@contend/protocol";
import type { CsvCell } from "@contend/protocol";
import type { AxisMark, Row } from "./chartData";
import { formatDateTime } from "./format";

export interface Compared {
  id: string;
  summary: SessionSummaryBody;
}

/** The key of session k's series in the by-round rows. */
export const sessionKey = (k: number) => `c${k}`;

/**
 * Each session's name in legends: "1. Title", numbered so two runs of the same drill stay apart;
 * a title that more than one compared session shares also carries its start time.
 */
export function sessionLabels(sessions: readonly Compared[]): string[] {
  const titles = sessions.map((s) => s.summary.session.title);
  return sessions.map((s, k) => {
    const t = titles[k]!;
    const shared = titles.filter((x) => x === t).length > 1;
    return `${k + 1}. ${t}${shared ? ` (${formatDateTime(s.summary.session.createdAt)})` : ""}`;
  });
}

/**
 * One row per round from 1 to the longest session's last round; a session without that round
 * (or without the figure) has null there: a gap, never 0.
 */
export function roundRows(
  sessions: readonly Compared[],
  pick: (r: SummaryRound) => number | null,
): Row[] {
  const last = Math.max(0, ...sessions.flatMap((s) => s.summary.rounds.map((r) => r.round)));
  const rows: Row[] = [];
  for (let round = 1; round <= last; round++) {
    const row: Row = { round };
    sessions.forEach((s, k) => {
      const r = s.summary.rounds.find((x) => x.round === round);
      row[sessionKey(k)] = r ? pick(r) : null;
    });
    rows.push(row);
  }
  return rows;
}

/** Rounds in which some compared session's contest changed (a shock before that round). */
export function changedRounds(sessions: readonly Compared[]): Set<number> {
  return new Set(
    sessions.flatMap((s) => s.summary.rounds.filter((r) => r.shock !== null).map((r) => r.round)),
  );
}

/**
 * The round-axis marks of a comparison: per round, which session (by number) had a shock
 * ("changed") or a facilitator's note ("note") there: "1 changed · 2 note".
 */
export function compareMarks(sessions: readonly Compared[]): AxisMark[] {
  const parts = new Map<number, string[]>();
  sessions.forEach((s, k) => {
    for (const r of s.summary.rounds) {
      const what = [r.shock ? "changed" : null, r.note ? "note" : null].filter(Boolean);
      if (what.length === 0) continue;
      parts.set(r.round, [...(parts.get(r.round) ?? []), `${k + 1} ${what.join(", ")}`]);
    }
  });
  return [...parts.entries()]
    .sort(([a], [b]) => a - b)
    .map(([x, ls]) => ({ x, label: ls.join(" \u00b7 ") }));
}

/** Every note and shock of the comparison in words, for the list under the charts. */
export function compareEvents(
  sessions: readonly Compared[],
): { session: number; round: number; kind: "changed" | "note"; text: string }[] {
  return sessions.flatMap((s, k) =>
    s.summary.rounds.flatMap((r) => [
      ...(r.shock
        ? [{ session: k, round: r.round, kind: "changed" as const, text: r.shock.text }]
        : []),
      ...(r.note ? [{ session: k, round: r.round, kind: "note" as const, text: r.note }] : []),
    ]),
  );
}

const SESSION_COLUMNS = ["sessionId", "title", "currency", "createdAt", "endedAt", "tags"] as const;
const ROUND_COLUMNS = [
  "round",
  "prize",
  "totalSpend",
  "equilibriumTotalSpend",
  "overspend",
  "nashGap",
  "nashGapShare",
  "dissipation",
  "shock",
  "note",
] as const;
const SEAT_COLUMNS = [
  "seat",
  "rival",
  "kind",
  "rounds",
  "meanSpend",
  "meanEquilibriumSpend",
  "totalRegret",
  "totalPayoff",
  "nearBestReply",
] as const;

/** The header of the cohort CSV: `record` says whether a row is a round or a seat. */
export const COHORT_HEADER: readonly string[] = [
  "record",
  ...SESSION_COLUMNS,
  ...ROUND_COLUMNS,
  ...SEAT_COLUMNS.filter((c) => !(ROUND_COLUMNS as readonly string[]).includes(c)),
];

/**
 * The cohort file: for every compared session, one `round` row per resolved round and one
 * `seat` row per seat that played, with the summary's figures under the API's own names (money
 * in the session's currency; `overspend` is spend / equilibrium spend on both kinds of row).
 * Cells a kind of row does not have stay empty.
 */
export function cohortCsv(sessions: readonly Compared[]): string {
  const rows: CsvCell[][] = [];
  for (const { summary } of sessions) {
    const base: Record<string, CsvCell> = {
      sessionId: summary.session.id,
      title: summary.session.title,
      currency: summary.session.currency,
      createdAt: summary.session.createdAt,
      endedAt: summary.session.endedAt,
      tags: summary.session.tags.join("; "),
    };
    for (const r of summary.rounds) {
      const cells: Record<string, CsvCell> = {
        ...base,
        record: "round",
        ...r,
        shock: r.shock?.text ?? null,
      };
      rows.push(COHORT_HEADER.map((c) => cells[c] ?? null));
    }
    for (const s of summary.seats) {
      if (s.rounds === 0) continue;
      const cells: Record<string, CsvCell> = { ...base, record: "seat", ...s };
      rows.push(COHORT_HEADER.map((c) => cells[c] ?? null));
    }
  }
  return toCsv(COHORT_HEADER, rows);
}
