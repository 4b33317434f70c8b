/**
 * The compare view's shaping of session summaries: rows by round, round-axis marks, and the
 * cohort CSV read back with papaparse (an independent RFC 4180 parser) against the summaries'
 * own numbers. The summaries come from summarizeSession over logs the engine played.
 */
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { summarizeSession } from "@contend/session";
import {
  COHORT_HEADER,
  cohortCsv,
  compareEvents,
  compareMarks,
  roundRows,
  sessionKey,
  sessionLabels,
} from "../src/lib/compare";
import type { Compared } from "../src/lib/compare";
import { playSession } from "./sessionLog";

function compared(log: ReturnType<typeof playSession>): Compared {
  const summary = summarizeSession(log);
  if (!summary) throw new Error("empty log");
  return { id: summary.session.id, summary };
}

const spring = compared(
  playSession({
    id: "s-spring",
    title: 'Kiosk lease, "spring", with a comma',
    spends: [30, 25, 20],
    shock: { beforeRound: 2, prize: 150 },
  }),
);
const autumn = compared(
  playSession({
    id: "s-autumn",
    title: "=Kiosk lease autumn",
    spends: [10, 12],
    note: { round: 2, text: "North held back" },
  }),
);

describe("roundRows(sessions, pick)", () => {
  it("roundRows gives one row per round of the longest session, null where a session has no such round", () => {
    const rows = roundRows([spring, autumn], (r) => r.overspend);
    expect(rows.map((r) => r.round)).toEqual([1, 2, 3]);
    expect(rows[0]![sessionKey(0)]).toBe(spring.summary.rounds[0]!.overspend);
    expect(rows[1]![sessionKey(1)]).toBe(autumn.summary.rounds[1]!.overspend);
    expect(rows[2]![sessionKey(1)]).toBeNull();
    expect(rows[2]![sessionKey(0)]).not.toBeNull();
  });
});

describe("sessionLabels(sessions)", () => {
  it("sessionLabels numbers each session and adds the start time only where titles repeat", () => {
    const rerun = compared(
      playSession({ id: "s-rerun", title: "=Kiosk lease autumn", spends: [9] }),
    );
    const labels = sessionLabels([spring, autumn, rerun]);
    expect(labels[0]).toBe('1. Kiosk lease, "spring", with a comma');
    expect(labels[1]).toMatch(/^2\. =Kiosk lease autumn \(\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC\)$/);
    expect(labels[2]).toMatch(/^3\. =Kiosk lease autumn \(/);
  });
});

describe("compareMarks(sessions)", () => {
  it("compareMarks names which session changed or has a note at each marked round", () => {
    expect(compareMarks([spring, autumn])).toEqual([{ x: 2, label: "1 changed \u00b7 2 note" }]);
    expect(compareMarks([autumn, spring])).toEqual([{ x: 2, label: "1 note \u00b7 2 changed" }]);
    expect(compareEvents([spring, autumn])).toEqual([
      { session: 0, round: 2, kind: "changed", text: "prize 100 -> 150" },
      { session: 1, round: 2, kind: "note", text: "North held back" },
    ]);
  });
});

describe("cohortCsv(sessions)", () => {
  it("cohortCsv writes every round and seat of every session; papaparse reads back the summary's numbers", () => {
    const text = cohortCsv([spring, autumn]);
    expect(text.endsWith("\r\n")).toBe(true);
    const parsed = Papa.parse<Record<string, string>>(text.trim(), { header: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual([...COHORT_HEADER]);
    const rows = parsed.data;
    const rounds = rows.filter((r) => r.record === "round");
    const seats = rows.filter((r) => r.record === "seat");
    expect(rounds).toHaveLength(3 + 2);
    expect(seats).toHaveLength(2 + 2);
    // the title with quotes and a comma survives; the one starting with "=" is defused
    expect(rounds[0]!.title).toBe('Kiosk lease, "spring", with a comma');
    expect(rounds.at(-1)!.title).toBe("'=Kiosk lease autumn");
    for (const [k, s] of [spring, autumn].entries()) {
      const mine = rounds.filter((r) => r.sessionId === s.id);
      s.summary.rounds.forEach((r, i) => {
        const row = mine[i]!;
        expect(Number(row.round), `session ${k} round`).toBe(r.round);
        expect(Number(row.totalSpend)).toBe(r.totalSpend);
        expect(Number(row.overspend)).toBe(r.overspend);
        expect(Number(row.nashGapShare)).toBe(r.nashGapShare);
        expect(Number(row.prize)).toBe(r.prize);
        expect(row.shock).toBe(r.shock?.text ?? "");
        expect(row.note).toBe(r.note ?? "");
        expect(row.rival).toBe("");
      });
      const seatRows = seats.filter((r) => r.sessionId === s.id);
      s.summary.seats.forEach((x, i) => {
        const row = seatRows[i]!;
        expect(row.rival).toBe(x.rival);
        expect(Number(row.totalRegret)).toBe(x.totalRegret);
        expect(Number(row.nearBestReply)).toBe(x.nearBestReply);
        expect(Number(row.overspend)).toBe(x.overspend);
        expect(row.round).toBe("");
      });
    }
    expect(rounds.find((r) => r.sessionId === "s-spring" && r.round === "2")!.prize).toBe("150");
  });
});
