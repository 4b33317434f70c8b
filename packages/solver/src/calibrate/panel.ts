/**
 * Checks a spend-and-share panel and indexes it for the log-centred regression. Every problem
 * comes back as a value naming the row, column, period or rival; rows that cannot enter a log
 * model (zero spend or zero share, or the only usable row of its period) are dropped and
 * counted, never silently.
 */
import type { InputError, Parsed } from "../types";
import { LIMITS } from "../validate";
import type { PanelRow } from "./types";

/** Shares of one period must add up to 1 within this tolerance (rounding in reported shares). */
export const SHARE_SUM_TOLERANCE = 0.02;

export interface IndexedPanel {
  /** rivals in first-appearance order */
  rivals: string[];
  /** every period in first-appearance order */
  periods: string[];
  /** usable observations grouped by period (periods in file order), rivals in file order within */
  obsRival: Int32Array;
  obsPeriod: Int32Array;
  spend: Float64Array;
  share: Float64Array;
  /** obs of regression period k are [start[k], start[k + 1]) */
  start: Int32Array;
  /** index into `periods` of regression period k */
  periodOf: Int32Array;
  dropped: number;
}

function fail(path: string, message: string): InputError {
  return { ok: false, path, message };
}

function quote(s: string): string {
  return JSON.stringify(s.length > 40 ? `${s.slice(0, 40)}...` : s);
}

function checkRow(r: PanelRow): InputError | null {
  const at = `row ${r.row}`;
  if (r.period.trim() === "") return fail(`${at}, column period`, "is empty");
  if (r.rival.trim() === "") return fail(`${at}, column rival`, "is empty");
  if (r.rival.length > LIMITS.nameMax) {
    return fail(`${at}, column rival`, `must be at most ${LIMITS.nameMax} characters`);
  }
  if (!Number.isFinite(r.spend)) return fail(`${at}, column spend`, "must be a finite number");
  if (r.spend < 0) return fail(`${at}, column spend`, `must be >= 0 (got ${r.spend})`);
  if (!Number.isFinite(r.share)) return fail(`${at}, column share`, "must be a finite number");
  if (r.share < 0 || r.share > 1) {
    return fail(
      `${at}, column share`,
      `must be a fraction from 0 to 1 or a percentage with % (got ${r.share})`,
    );
  }
  return null;
}

/** Validates and indexes the panel. */
export function indexPanel(rows: readonly PanelRow[]): Parsed<IndexedPanel> {
  if (rows.length === 0) return fail("rows", "there are no data rows");
  const rivalIx = new Map<string, number>();
  const periodIx = new Map<string, number>();
  const byPeriod: PanelRow[][] = [];
  const seen = new Map<string, number>();
  for (const r of rows) {
    const bad = checkRow(r);
    if (bad) return bad;
    if (!rivalIx.has(r.rival)) rivalIx.set(r.rival, rivalIx.size);
    let t = periodIx.get(r.period);
    if (t === undefined) {
      t = periodIx.size;
      periodIx.set(r.period, t);
      byPeriod.push([]);
    }
    const key = JSON.stringify([r.period, r.rival]);
    const prev = seen.get(key);
    if (prev !== undefined) {
      return fail(
        `row ${r.row}`,
        `rival ${quote(r.rival)} appears twice in period ${quote(r.period)} (also row ${prev})`,
      );
    }
    seen.set(key, r.row);
    byPeriod[t]!.push(r);
  }
  const rivals = [...rivalIx.keys()];
  const periods = [...periodIx.keys()];
  if (rivals.length > LIMITS.rivalsMax) {
    return fail("column rival", `names ${rivals.length} rivals; at most ${LIMITS.rivalsMax}`);
  }
  for (let t = 0; t < periods.length; t++) {
    const rs = byPeriod[t]!;
    const sum = rs.reduce((a, r) => a + r.share, 0);
    if (Math.abs(sum - 1) > SHARE_SUM_TOLERANCE + 1e-12) {
      const hint = sum > 1.5 ? "; write percentages with %" : "";
      return fail(
        `period ${quote(periods[t]!)} (rows ${rs.map((r) => r.row).join(", ")})`,
        `shares sum to ${+sum.toPrecision(6)}, outside 0.98 to 1.02${hint}`,
      );
    }
  }
  if (rivals.length < 2) return fail("column rival", "names only one rival; need at least 2");
  if (periods.length < 3) {
    return fail("column period", `names only ${periods.length} period(s); need at least 3`);
  }

  // Usable rows: positive spend and share, in periods with at least two of them.
  let dropped = 0;
  const kept: PanelRow[][] = [];
  const keptPeriod: number[] = [];
  const usableCount = new Array<number>(rivals.length).fill(0);
  for (let t = 0; t < periods.length; t++) {
    const rs = byPeriod[t]!;
    const ok = rs.filter((r) => r.spend > 0 && r.share > 0);
    dropped += rs.length - ok.length;
    if (ok.length < 2) {
      dropped += ok.length;
      continue;
    }
    ok.sort((a, b) => rivalIx.get(a.rival)! - rivalIx.get(b.rival)!);
    kept.push(ok);
    keptPeriod.push(t);
    for (const r of ok) usableCount[rivalIx.get(r.rival)!]! += 1;
  }
  const empty = usableCount.findIndex((c) => c === 0);
  if (empty >= 0) {
    return fail(
      `rival ${quote(rivals[empty]!)}`,
      "has no usable rows (a row needs spend > 0 and share > 0 in a period with another such rival)",
    );
  }
  if (kept.length < 3) {
    return fail(
      "column period",
      `only ${kept.length} period(s) have two or more rivals with spend > 0 and share > 0; need at least 3`,
    );
  }
  const n = kept.reduce((a, rs) => a + rs.length, 0);
  const df = n - kept.length - rivals.length;
  if (df < 1) {
    return fail(
      "rows",
      `${n} usable observations over ${kept.length} periods leave no residual degrees of freedom for ${rivals.length} rivals (n - T - N = ${df}); add periods`,
    );
  }
  const obsRival = new Int32Array(n);
  const obsPeriod = new Int32Array(n);
  const spend = new Float64Array(n);
  const share = new Float64Array(n);
  const start = new Int32Array(kept.length + 1);
  let k = 0;
  kept.forEach((rs, p) => {
    start[p] = k;
    for (const r of rs) {
      obsRival[k] = rivalIx.get(r.rival)!;
      obsPeriod[k] = keptPeriod[p]!;
      spend[k] = r.spend;
      share[k] = r.share;
      k++;
    }
  });
  start[kept.length] = n;
  return {
    ok: true,
    value: {
      rivals,
      periods,
      obsRival,
      obsPeriod,
      spend,
      share,
      start,
      periodOf: Int32Array.from(keptPeriod),
      dropped,
    },
  };
}
