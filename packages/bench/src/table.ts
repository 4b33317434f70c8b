/** Plain-text tables for terminal output and for pasting into Markdown. */

export type Cell = string | number | boolean | null;

export function fmt(value: Cell, digits = 1): string {
  if (value === null) return "-";
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "number") {
    if (Number.isNaN(value)) return "n/a";
    if (Number.isInteger(value)) return String(value);
    return value.toFixed(digits);
  }
  return value;
}

/** A Markdown table whose columns are padded so it also reads well in a terminal. */
export function markdownTable(header: readonly string[], rows: readonly Cell[][]): string {
  const body = rows.map((r) => r.map((c) => fmt(c)));
  const widths = header.map((h, i) =>
    Math.max(h.length, 3, ...body.map((b) => (b[i] ?? "").length)),
  );
  const line = (cells: readonly string[]) =>
    `| ${cells.map((c, i) => c.padEnd(widths[i]!)).join(" | ")} |`;
  return [
    line(header),
    `| ${widths.map((w) => "-".repeat(w)).join(" | ")} |`,
    ...body.map(line),
  ].join("\n");
}
