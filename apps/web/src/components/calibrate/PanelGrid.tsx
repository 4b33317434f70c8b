"use client";

import type { GridRow } from "../../lib/calibrateView";
import { newGridRow } from "../../lib/calibrateView";

const CELLS = [
  { key: "period", label: "Period", numeric: false, width: "5rem" },
  { key: "rival", label: "Rival", numeric: false, width: "8rem" },
  { key: "spend", label: "Spend", numeric: true, width: "5rem" },
  { key: "share", label: "Share", numeric: true, width: "4.5rem" },
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
      <p className="small muted" style={{ margin: "0.4rem 0" }}>
        One row per rival and period; spend in money, share as 0.25 or 25%. Row numbers match the
        CSV (row 1 is its header).
      </p>
      <div className="table-wrap" style={{ maxHeight: 360, overflow: "auto" }}>
        <table className="editor-table panel-grid" data-testid="calibrate-grid">
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
                      style={{ width: c.width, minWidth: c.width }}
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
