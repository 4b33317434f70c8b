"use client";

import type { GridRow } from "../../lib/calibrate-view";
import { newGridRow } from "../../lib/calibrate-view";

const CELLS = [
  { key: "period", label: "Period", numeric: false },
  { key: "rival", label: "Rival", numeric: false },
  { key: "spend", label: "Spend (money)", numeric: true },
  { key: "share", label: "Share (0-1 or %)", numeric: true },
] as const;

/** The panel typed in a grid; row numbers are the CSV's (row 1 is the header). */
export function PanelGrid({
  grid,
  onChange,
}: {
  grid: readonly GridRow[];
  onChange: (grid: GridRow[]) => void;
}) {
  const set = (k: number, key: (typeof CELLS)[number]["key"], value: string) =>
    onChange(grid.map((g, j) => (j === k ? { ...g, [key]: value } : g)));
  return (
    <div>
      <div className="table-wrap" style={{ maxHeight: 360, overflow: "auto" }}>
        <table className="editor-table" data-testid="calibrate-grid">
          <caption className="small muted" style={{ textAlign: "left" }}>
            One row per rival and period. Row numbers match the CSV (row 1 is its header).
          </caption>
          <thead>
            <tr>
              <th scope="col" className="num">
                Row
              </th>
              {CELLS.map((c) => (
                <th key={c.key} scope="col">
                  {c.label}
                </th>
              ))}
              <th scope="col">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {grid.map((g, k) => (
              <tr key={g.key}>
                <td className="num small muted">{k + 2}</td>
                {CELLS.map((c) => (
                  <td key={c.key}>
                    <input
                      type="text"
                      inputMode={c.numeric ? "decimal" : undefined}
                      autoComplete="off"
                      aria-label={`${c.label}, row ${k + 2}`}
                      value={g[c.key]}
                      onChange={(e) => set(k, c.key, e.target.value)}
                      data-testid={`grid-${k}-${c.key}`}
                    />
                  </td>
                ))}
                <td>
                  <button
                    type="button"
                    onClick={() => onChange(grid.filter((_, j) => j !== k))}
                    aria-label={`Remove row ${k + 2}`}
                  >
                    ×
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <button
        type="button"
        style={{ marginTop: "0.5rem" }}
        onClick={() => onChange([...grid, newGridRow()])}
        data-testid="grid-add-row"
      >
        Add row
      </button>
    </div>
  );
}
