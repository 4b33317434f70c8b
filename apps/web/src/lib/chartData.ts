/**
 * Shapes solver and session results into the flat rows the charts and their data tables
 * read: one object per x value, one key per series. Unknown values stay null (a gap in the
 * line, a dash in the table), never 0.
 */
import type { Sweep1d } from "@contend/solver";
import type { RoundResult } from "@contend/protocol";

export type Row = Record<string, number | string | null>;

export const effortKey = (i: number) => `effort${i}`;
export const payoffKey = (i: number) => `payoff${i}`;

/** Sweep -> rows {x, effort0.., payoff0.., total, dissipation, kind}. */
export function sweepRows(sweep: Sweep1d): Row[] {
  return sweep.values.map((x, k) => {
    const row: Row = { x, kind: sweep.kinds[k] ?? null };
    sweep.names.forEach((_, i) => {
      row[effortKey(i)] = sweep.efforts[i]?.[k] ?? null;
      row[payoffKey(i)] = sweep.payoffs[i]?.[k] ?? null;
    });
    row.total = sweep.totalEffort[k] ?? null;
    row.dissipation = sweep.dissipation[k] ?? null;
    return row;
  });
}

/** Where a series turns: indices k at which the sign of the slope changes (ignoring nulls and flats). */
export function turningPoints(values: readonly (number | null)[]): number[] {
  const out: number[] = [];
  let lastSign = 0;
  let lastIndex = -1;
  let prev: { k: number; v: number } | null = null;
  for (let k = 0; k < values.length; k++) {
    const v = values[k];
    if (v === null || v === undefined || !Number.isFinite(v)) continue;
    if (prev !== null) {
      const d = v - prev.v;
      const sign = Math.abs(d) <= 1e-12 * Math.max(1, Math.abs(prev.v)) ? 0 : Math.sign(d);
      if (sign !== 0) {
        if (lastSign !== 0 && sign !== lastSign) out.push(lastIndex);
        lastSign = sign;
        lastIndex = k;
      }
    }
    prev = { k, v };
  }
  return out;
}

export function equilibriumPayoffOf(round: RoundResult, seat: number): number | null {
  const k = round.seatIndices.indexOf(seat);
  if (k < 0) return null;
  return round.equilibrium.payoffs?.[k] ?? null;
}

/** One seat across rounds, in money: spend, equilibrium spend, best reply, regret, payoff, total. */
export function seatHistoryRows(rounds: readonly RoundResult[], seat: number): Row[] {
  return rounds
    .filter((r) => r.seatIndices.includes(seat))
    .map((r) => ({
      round: r.round,
      spend: r.spends[seat] ?? null,
      equilibrium: r.equilibriumSpends[seat] ?? null,
      bestResponse: r.bestResponseSpends[seat] ?? null,
      regret: r.regrets[seat] ?? null,
      payoff: r.payoffs[seat] ?? null,
      total: r.totals[seat] ?? null,
    }));
}

/** One round, in money: per playing seat, spend vs equilibrium spend, share, payoff, regret. */
export function roundSeatRows(round: RoundResult, names: readonly string[]): Row[] {
  return round.seatIndices.map((seat) => ({
    seat,
    name: names[seat] ?? `Seat ${seat + 1}`,
    spend: round.spends[seat] ?? null,
    equilibrium: round.equilibriumSpends[seat] ?? null,
    share: round.shares[seat] ?? null,
    payoff: round.payoffs[seat] ?? null,
    regret: round.regrets[seat] ?? null,
    bestResponse: round.bestResponseSpends[seat] ?? null,
    total: round.totals[seat] ?? null,
    defaulted: round.defaulted[seat] === true ? "yes" : "no",
  }));
}

/** Every seat across rounds, one key per seat: for the regret and effort-gap charts. */
export function perSeatOverRounds(
  rounds: readonly RoundResult[],
  seats: readonly number[],
  pick: (r: RoundResult, seat: number) => number | null,
): Row[] {
  return rounds.map((r) => {
    const row: Row = { round: r.round };
    for (const s of seats) row[`s${s}`] = r.seatIndices.includes(s) ? pick(r, s) : null;
    return row;
  });
}

/** At most this many ticks on a whole-number axis (a phone's narrow chart still reads). */
export const MAX_WHOLE_TICKS = 10;

/**
 * Ticks for an x axis whose values are all whole numbers (rounds): each whole number from the
 * smallest to the largest, thinned to every 2nd, 5th, 10th... when there are more than
 * `maxTicks`, so no tick repeats a label ("1, 2, 2, 3") or sits between two rounds. Null when
 * some x is not a whole number (the axis then picks its own ticks).
 */
export function wholeNumberTicks(
  rows: readonly Row[],
  key: string,
  maxTicks = MAX_WHOLE_TICKS,
): number[] | null {
  const xs = rows.map((r) => r[key]).filter((v): v is number => typeof v === "number");
  if (xs.length === 0 || !xs.every(Number.isInteger)) return null;
  const lo = Math.min(...xs);
  const hi = Math.max(...xs);
  const span = hi - lo;
  const steps = [1, 2, 5];
  let step = 1;
  for (let scale = 1; ; scale *= 10) {
    const fit = steps.map((s) => s * scale).find((s) => Math.floor(span / s) + 1 <= maxTicks);
    if (fit !== undefined) {
      step = fit;
      break;
    }
  }
  const ticks: number[] = [];
  for (let t = lo; t <= hi; t += step) ticks.push(t);
  return ticks;
}

/** A mark on a chart's x axis (a shocked round, a round with a note). */
export interface AxisMark {
  x: number;
  label: string;
}

/**
 * The marks for a round axis: every round whose contest changed from the round before
 * ("changed") and every round the facilitator wrote a note on ("note"), one mark per round.
 */
export function roundMarks(
  changedRounds: Iterable<number>,
  rounds: readonly { round: number; note?: string | undefined }[] = [],
): AxisMark[] {
  const labels = new Map<number, string[]>();
  const add = (x: number, label: string) => labels.set(x, [...(labels.get(x) ?? []), label]);
  for (const r of changedRounds) add(r, "changed");
  for (const r of rounds) if (r.note && r.note.trim() !== "") add(r.round, "note");
  return [...labels.entries()]
    .sort(([a], [b]) => a - b)
    .map(([x, ls]) => ({ x, label: ls.join(", ") }));
}
