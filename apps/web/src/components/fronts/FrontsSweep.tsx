"use client";

import { memo, useMemo } from "react";
import type { FrontsScenario, FrontsSweepPoint } from "@contend/solver";
import { frontsParamPaths } from "@contend/solver";
import { frontsParamValue } from "../../lib/frontsForm";
import type { FrontsSweepSettings } from "../../lib/frontsState";
import { formatCompact, formatMoney, formatNumber } from "../../lib/format";
import { seriesColour } from "../../lib/palette";
import type { Row } from "../../lib/chartData";
import { useFrontsSweepRun } from "../../hooks/useFrontsWorker";
import { DataTable } from "../DataTable";
import { SelectField, TextField } from "../Field";
import { LineSeriesChart } from "../LineSeriesChart";
import { RunProgress } from "../RunControls";

const STEPS_MAX = 101;

/**
 * One front or rival parameter swept over a range; each rival's spend, shadow price or payoff
 * along it. The sweep runs in a Web Worker with progress and a cancel button; the settings
 * live in the page address (see frontsState.ts).
 */
export function FrontsSweep({
  scenario,
  settings,
  onSettings,
}: {
  scenario: FrontsScenario;
  settings: FrontsSweepSettings;
  onSettings: (s: FrontsSweepSettings) => void;
}) {
  const options = useMemo(
    () => frontsParamPaths(scenario).map((p) => ({ value: p.path, label: p.label })),
    [scenario],
  );
  const { param, from, to, steps, metric } = settings;
  const set = (p: Partial<FrontsSweepSettings>) => onSettings({ ...settings, ...p });
  const sweep = useFrontsSweepRun();
  const state = sweep.state;
  const cur = frontsParamValue(scenario, param);
  const fromText = from !== "" ? from : cur !== null ? String(cur / 2) : "";
  const toText = to !== "" ? to : cur !== null ? String(cur * 2) : "";
  const metrics = [
    { value: "total", label: "Total spend" },
    ...scenario.fronts.map((f, k) => ({ value: `front:${k}`, label: `Spend on ${f.name}` })),
    { value: "shadow", label: "Shadow price of the budget" },
    { value: "payoff", label: "Payoff" },
  ];
  const run = () =>
    sweep.run(scenario, {
      param,
      from: Number(fromText),
      to: Number(toText),
      steps: Math.min(STEPS_MAX, Math.max(2, Math.round(Number(steps)) || 2)),
    });
  const done = state.status === "done" ? state : null;
  const stale = done !== null && JSON.stringify(done.scenario) !== JSON.stringify(scenario);
  return (
    <section className="card" aria-labelledby="fronts-sweep-title">
      <h2 id="fronts-sweep-title">Sweep a front or rival parameter</h2>
      <div className="row" style={{ alignItems: "flex-end", flexWrap: "wrap" }}>
        <SelectField
          label="Parameter"
          value={param}
          options={options}
          onChange={(v) => set({ param: v, from: "", to: "" })}
          testId="fronts-sweep-param"
        />
        <TextField
          label="From"
          numeric
          value={fromText}
          onChange={(v) => set({ from: v })}
          width="8rem"
          testId="fronts-sweep-from"
        />
        <TextField
          label="To"
          numeric
          value={toText}
          onChange={(v) => set({ to: v })}
          width="8rem"
          testId="fronts-sweep-to"
        />
        <TextField
          label={`Points (2-${STEPS_MAX})`}
          numeric
          value={steps}
          onChange={(v) => set({ steps: v })}
          width="8rem"
          testId="fronts-sweep-steps"
        />
        <SelectField
          label="Show"
          value={metric}
          options={metrics}
          onChange={(v) => set({ metric: v })}
          testId="fronts-sweep-metric"
        />
        {/* its own pair, not RunOrCancel: keyed buttons, no spacer above, "Cancel sweep" */}
        <div className="field">
          {state.status === "running" ? (
            // distinct keys: a click meant for Cancel never lands on Run after a sweep ends
            <button
              key="cancel"
              type="button"
              onClick={sweep.cancel}
              data-testid="fronts-sweep-cancel"
            >
              Cancel sweep
            </button>
          ) : (
            <button key="run" type="button" onClick={run} data-testid="fronts-sweep-run">
              Run sweep
            </button>
          )}
        </div>
      </div>
      <div aria-live="polite">
        <RunProgress
          state={state}
          label="Sweep points solved"
          unit="points"
          testId="fronts-sweep"
          cancelled="Sweep cancelled."
        />
        {state.status === "error" && (
          <p className="field-error" role="alert">
            {state.message}
          </p>
        )}
      </div>
      {done && stale && (
        <p className="small muted" data-testid="fronts-sweep-stale">
          This sweep ran on the scenario before your last edits; run it again to update.
        </p>
      )}
      {done && <SweepResults done={done} metric={metric} />}
    </section>
  );
}

type Done = Extract<ReturnType<typeof useFrontsSweepRun>["state"], { status: "done" }>;

/**
 * The finished sweep's chart and table, labelled from the scenario it ran on. Memoised: edits
 * elsewhere on the page do not redraw a long sweep.
 */
const SweepResults = memo(function SweepResults({ done, metric }: { done: Done; metric: string }) {
  const sc = done.scenario;
  const currency = sc.currency ?? null;
  const pick = (eq: FrontsSweepPoint["equilibrium"], i: number): number | null => {
    if (eq.kind !== "pure") return null;
    if (metric === "total") return eq.budgetUsed![i]!;
    if (metric === "shadow") return eq.shadowPrices![i] ?? null;
    if (metric === "payoff") return eq.payoffs![i]!;
    const k = Number(metric.split(":")[1]);
    return eq.spends![i]![k] ?? null;
  };
  const label =
    frontsParamPaths(sc).find((o) => o.path === done.spec.param)?.label ?? done.spec.param;
  const rows: Row[] = done.points.map((p) => {
    const row: Row = { x: p.value };
    sc.rivals.forEach((_, i) => (row[`r${i}`] = pick(p.equilibrium, i)));
    return row;
  });
  const series = sc.rivals.map((r, i) => ({ key: `r${i}`, name: r.name, colour: seriesColour(i) }));
  const isMoney = metric !== "shadow";
  const k = metric.startsWith("front:") ? Number(metric.split(":")[1]) : -1;
  const yLabel =
    metric === "total"
      ? "Total spend"
      : metric === "shadow"
        ? "Shadow price of the budget"
        : metric === "payoff"
          ? "Payoff"
          : `Spend on ${sc.fronts[k]?.name ?? `front ${k + 1}`}`;
  const anyPure = done.points.some((p) => p.equilibrium.kind === "pure");
  return (
    <>
      {!anyPure && (
        <p className="small" role="status" data-testid="fronts-sweep-none">
          No pure-strategy equilibrium at any point of this sweep: the chart and table stay blank
          (the reason is in the equilibrium&apos;s note above).
        </p>
      )}
      <LineSeriesChart
        rows={rows}
        xKey="x"
        series={series}
        xLabel={label}
        yLabel={isMoney ? `${yLabel} (${currency ?? "money"})` : `${yLabel} (per unit of money)`}
        formatY={(v) => formatNumber(v)}
        formatX={formatCompact}
        // sweep values (prizes, budgets) are long numbers: few ticks so a phone's axis reads
        maxXTicks={5}
        testId="fronts-sweep-chart"
        slide={{
          title: `${yLabel} at equilibrium as ${label} varies`,
          caption: `${yLabel} of each rival at the pure equilibrium of the fronts contest, at each value of ${label}, the other inputs held fixed; gaps where no pure equilibrium was found. A model's comparative statics, not a forecast.`,
        }}
      />
      <DataTable
        rows={rows}
        caption={`${yLabel} along ${label}; blank where no pure equilibrium was found`}
        testId="fronts-sweep-table"
        columns={[
          { key: "x", label, format: (v) => formatNumber(v) },
          ...sc.rivals.map((r, i) => ({
            key: `r${i}`,
            label: r.name,
            format: isMoney
              ? (v: number) => formatMoney(v, currency)
              : (v: number) => formatNumber(v, 3),
          })),
        ]}
      />
    </>
  );
});
