"use client";

import { useId, useState } from "react";
import { DEMO_PANEL } from "@contend/solver";
import { csvToGrid, gridToCsv, newGridRow, type GridRow } from "../../lib/calibrateView";
import { PanelGrid } from "./PanelGrid";

export interface DataSource {
  text: string;
  /** a file name or label, kept in the scenario's provenance */
  source: string;
}

/** A source label once its text has been changed by hand. */
function edited(source: string): string {
  if (source === "" || source === "pasted data" || source.endsWith(" (edited)")) {
    return source || "pasted data";
  }
  return `${source} (edited)`;
}

/**
 * Where the panel comes from: pasted or uploaded CSV text, the invented demo, or a grid. The CSV
 * text is the one source of truth; grid edits rewrite it, and switching to the grid reads it.
 */
export function DataInput({
  data,
  onData,
  onDemo,
  problem,
}: {
  data: DataSource;
  onData: (d: DataSource) => void;
  onDemo: () => void;
  /** the reader's or the fit's problem, shown under the input too (on a phone it is far away) */
  problem: string | null;
}) {
  const [mode, setMode] = useState<"text" | "grid">("text");
  const [grid, setGrid] = useState<GridRow[]>([]);
  const [switchError, setSwitchError] = useState<string | null>(null);
  const textId = useId();

  function toGrid() {
    if (data.text.trim() === "") {
      setGrid([newGridRow(), newGridRow(), newGridRow()]);
      setSwitchError(null);
      setMode("grid");
      return;
    }
    const r = csvToGrid(data.text);
    if (!r.ok) {
      setSwitchError(`Fix the text first (${r.path ? `${r.path}: ` : ""}${r.message}).`);
      return;
    }
    setGrid(r.grid);
    setSwitchError(null);
    setMode("grid");
  }

  function editGrid(next: GridRow[]) {
    setGrid(next);
    onData({ text: gridToCsv(next), source: data.source ? edited(data.source) : "typed data" });
  }

  async function onFile(e: React.ChangeEvent<HTMLInputElement>) {
    const file = e.target.files?.[0];
    if (!file) return;
    onData({ text: await file.text(), source: file.name });
    setMode("text");
    e.target.value = "";
  }

  return (
    <div>
      <div className="row" style={{ justifyContent: "space-between", alignItems: "center" }}>
        <div className="segmented" role="radiogroup" aria-label="How to enter the data">
          <label>
            <input
              type="radio"
              name="calibrate-mode"
              checked={mode === "text"}
              onChange={() => setMode("text")}
              data-testid="mode-text"
            />
            CSV text
          </label>
          <label>
            <input
              type="radio"
              name="calibrate-mode"
              checked={mode === "grid"}
              onChange={toGrid}
              data-testid="mode-grid"
            />
            Grid
          </label>
        </div>
        <button type="button" onClick={onDemo} data-testid="load-demo">
          Load demo data
        </button>
      </div>
      {switchError && (
        <p className="small field-error" role="alert">
          {switchError}
        </p>
      )}
      {mode === "text" ? (
        <>
          <div className="field" style={{ marginTop: "0.6rem" }}>
            <label htmlFor={textId}>
              Paste CSV{" "}
              <span className="hint">
                (header period, rival, spend, share in any order; share as 0.25 or 25%)
              </span>
            </label>
            <textarea
              id={textId}
              rows={10}
              className="mono"
              spellCheck={false}
              value={data.text}
              placeholder={"period,rival,spend,share\n2024-Q1,North Ovens,12000,31%"}
              onChange={(e) => onData({ text: e.target.value, source: edited(data.source) })}
              data-testid="calibrate-text"
            />
          </div>
          <div className="row" style={{ marginTop: "0.4rem" }}>
            <input
              type="file"
              accept=".csv,text/csv,text/plain"
              onChange={onFile}
              aria-label="Upload a CSV file"
              data-testid="calibrate-file"
            />
          </div>
        </>
      ) : (
        <PanelGrid grid={grid} onChange={editGrid} />
      )}
      <p className="small field-error" data-testid="calibrate-input-error">
        {problem ?? ""}
      </p>
      <p className="small muted">
        Source: <span data-testid="calibrate-source">{data.source || "none yet"}</span>
        {data.source === DEMO_PANEL.file ? " (invented demo data)" : ""}
      </p>
    </div>
  );
}
