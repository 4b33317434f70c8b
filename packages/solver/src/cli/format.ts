/** Plain-text formatting for the CLI: numbers, tables, CSV. */

/** Six significant digits with thousands separators; exponents for tiny or huge magnitudes. */
export function fmt(x: number | null | undefined): string {
  if (x === null || x === undefined || Number.isNaN(x)) return "-";
  if (!Number.isFinite(x)) return x > 0 ? "unlimited" : "-unlimited";
  if (x === 0) return "0";
  const a = Math.abs(x);
  if (a < 1e-3 || a >= 1e12) return x.toExponential(2);
  return x.toLocaleString("en-US", { maximumSignificantDigits: 6 });
}

export function pct(x: number | null | undefined): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return "-";
  return `${(x * 100).toLocaleString("en-US", { maximumFractionDigits: 2, minimumFractionDigits: 2 })}%`;
}

export function money(x: number | null | undefined, currency?: string | null): string {
  const s = fmt(x);
  return currency && s !== "-" ? `${currency} ${s}` : s;
}

/** Left-aligns the first column, right-aligns the others. */
export function table(header: string[], rows: string[][]): string {
  const widths = header.map((h, c) => Math.max(h.length, ...rows.map((r) => (r[c] ?? "").length)));
  const line = (cells: string[]) =>
    cells
      .map((cell, c) => (c === 0 ? cell.padEnd(widths[c]!) : cell.padStart(widths[c]!)))
      .join("  ")
      .trimEnd();
  const rule = widths.map((w) => "-".repeat(w)).join("  ");
  return [line(header), rule, ...rows.map(line)].join("\n");
}

export function csvCell(x: string | number | null): string {
  if (x === null) return "";
  const s = String(x);
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function csvLine(cells: (string | number | null)[]): string {
  return cells.map(csvCell).join(",");
}

export const CAUTIONS = [
  "Caution: a stylised model to aid thinking, not a forecast and not financial or legal advice.",
  "Keep war-gaming internal: never share effort plans, bids or budgets with actual competitors",
  "(coordinating them can breach competition law). Public procurement follows its own rules;",
  "defer to counsel and local rules.",
].join("\n");
