"use client";

import type { Dispatch, SetStateAction } from "react";
import type { SweepState } from "../../hooks/useSweepWorker";
import type { AxisText } from "../../hooks/useSweepAxis";
import { formatNumber } from "../../lib/format";
import { SelectField, TextField } from "../Field";
import { RunOrCancel, RunProgress } from "../RunControls";

/** Errors the axis fields show beside themselves; any other sweep error shows below the row. */
const FIELD_PATHS = ["sweep.param", "sweep.from", "sweep.to", "sweep.steps"];

/** The swept parameter, its range and point count, run/cancel, and the sweep's progress. */
export function SweepControls({
  axis,
  setAxis,
  paramOptions,
  pickParam,
  state,
  run,
  cancel,
}: {
  axis: AxisText;
  setAxis: Dispatch<SetStateAction<AxisText>>;
  paramOptions: { path: string; label: string }[];
  pickParam: (param: string) => void;
  state: SweepState;
  run: () => void;
  cancel: () => void;
}) {
  const axisError = state.status === "error" ? state : null;
  const axisErr = (k: string) =>
    axisError && axisError.path === `sweep.${k}` ? axisError.message : undefined;
  return (
    <>
      <div className="row" style={{ alignItems: "flex-start" }}>
        <SelectField
          label="Parameter"
          value={axis.param}
          options={paramOptions.map((o) => ({ value: o.path, label: o.label }))}
          onChange={pickParam}
          error={axisErr("param")}
          testId="sweep-param"
        />
        <TextField
          label="From"
          numeric
          value={axis.from}
          onChange={(v) => setAxis((a) => ({ ...a, from: v }))}
          error={axisErr("from")}
          testId="sweep-from"
          width="9rem"
        />
        <TextField
          label="To"
          numeric
          value={axis.to}
          onChange={(v) => setAxis((a) => ({ ...a, to: v }))}
          error={axisErr("to")}
          testId="sweep-to"
          width="9rem"
        />
        <TextField
          label="Points"
          numeric
          value={axis.steps}
          onChange={(v) => setAxis((a) => ({ ...a, steps: v }))}
          error={axisErr("steps")}
          testId="sweep-steps"
          width="7rem"
        />
        <RunOrCancel
          running={state.status === "running"}
          onRun={run}
          onCancel={cancel}
          runLabel="Run sweep"
          testId="sweep"
          primary
        />
      </div>
      <div style={{ minHeight: "2.2rem" }} aria-live="polite">
        <RunProgress state={state} label="Sweep progress" unit="points" testId="sweep" />
        {state.status === "done" && (
          <p className="small muted" data-testid="sweep-status">
            {state.sweep.values.length} points in {formatNumber(state.ms, 0)} ms
            {state.sweep.kinds.some((k) => k === "none-pure")
              ? " · gaps: no pure equilibrium there"
              : ""}
          </p>
        )}
        {axisError && !FIELD_PATHS.includes(axisError.path) && (
          <p className="field-error">{axisError.message}</p>
        )}
      </div>
    </>
  );
}
