import type { Row } from "../lib/chartData";
import { formatNumber } from "../lib/format";

export interface Column {
  key: string;
  label: string;
  format?: (v: number) => string;
}

function cell(v: Row[string] | undefined, format?: (v: number) => string): string {
  if (v === null || v === undefined) return "\u2013";
  if (typeof v === "number") return format ? format(v) : formatNumber(v);
  return v;
}

/** A column is right-aligned unless its first known value is text. */
function numericColumn(rows: readonly Row[], key: string): boolean {
  const first = rows.find((r) => r[key] !== null && r[key] !== undefined)?.[key];
  return typeof first !== "string";
}

/** The plotted numbers as a table under each chart, for screen readers, print and tests. */
export function DataTable({
  rows,
  columns,
  caption,
  testId,
  maxHeight = 240,
}: {
  rows: readonly Row[];
  columns: readonly Column[];
  caption: string;
  testId?: string;
  maxHeight?: number;
}) {
  return (
    <div
      className="table-wrap data-table-box"
      style={{ maxHeight, overflow: "auto" }}
      tabIndex={0}
      role="region"
      aria-label={caption}
    >
      <table data-testid={testId}>
        <caption className="small muted" style={{ textAlign: "left" }}>
          {caption}
        </caption>
        <thead>
          <tr>
            {columns.map((c) => (
              <th
                key={c.key}
                scope="col"
                className={numericColumn(rows, c.key) ? "num" : undefined}
              >
                {c.label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r, k) => (
            <tr key={k}>
              {columns.map((c) => (
                <td
                  key={c.key}
                  className={typeof r[c.key] === "string" ? undefined : "num"}
                  data-col={c.key}
                >
                  {cell(r[c.key], c.format)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
