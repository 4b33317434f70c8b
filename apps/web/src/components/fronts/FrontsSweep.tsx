"use client";

import { useMemo, useState } from "react";
import type { FrontsScenario, FrontsSweepPoint } from "@contend/solver";
import { frontsParamPaths, sweepFronts } from "@contend/solver";
import { frontsParamValue } from "../../lib/frontsForm";
import { formatMoney, formatNumber } from "../../lib/format";
import { seriesColour } from "../../lib/palette";
import type { Row } from "../../lib/chartData";
import { DataTable } from "../DataTable";
import { SelectField, TextField } from "../Field";
import { LineSeriesChart } from "../LineSeriesChart";

const STEPS_MAX = 41;

/** One front or rival parameter swept over a range; each rival's spend, shadow price or payoff along it. */
export function FrontsSweep({ scenario }: { scenario: FrontsScenario }) {
  const options = useMemo(
    () => frontsParamPaths(scenario).map((p) => ({ value: p.path, label: p.label })),
    [scenario],
  );
  const [param, setParam] = useState(options[0]?.value ?? "");
  const [from, setFrom] = useState("");
  const [to, setTo] = useState("");
  const [steps, setSteps] = useState("21");
  const [metric, setMetric] = useState("front:0");
  const [result, setResult] = useState<
    { points: FrontsSweepPoint[]; label: string } | { error: string } | null
  >(null);
  const cur = frontsParamValue(scenario, param);
  const fromText = from !== "" ? from : cur !== null ? String(cur / 2) : "";
  const toText = to !== "" ? to : cur !== null ? String(cur * 2) : "";
  const metrics = [
    { value: "total", label: "Total spend" },
    ...scenario.fronts.map((f, k) => ({ value: `front:${k}`, label: `Spend on ${f.name}` })),
    { value: "shadow", label: "Shadow price of the budget" },
    { value: "payoff", label: "Payoff" },
  ];
  const money = (v: number) => formatMoney(v, scenario.currency ?? null);
  const run = () => {
    const res = sweepFronts(scenario, {
      param,
      from: Number(fromText),
      to: Number(toText),
      steps: Math.min(STEPS_MAX, Math.max(2, Math.round(Number(steps)) || 2)),
    });
    const label = options.find((o) => o.value === param)?.label ?? param;
    setResult(res.ok ? { points: res.value, label } : { error: `${res.path}: ${res.message}` });
  };
  const pick = (eq: FrontsSweepPoint["equilibrium"], i: number): number | null => {
    if (eq.kind !== "pure") return null;
    if (metric === "total") return eq.budgetUsed![i]!;
    if (metric === "shadow") return eq.shadowPrices![i] ?? null;
    if (metric === "payoff") return eq.payoffs![i]!;
    const k = Number(metric.split(":")[1]);
    return eq.spends![i]![k] ?? null;
  };
  const rows: Row[] =
    result && "points" in result
      ? result.points.map((p) => {
          const row: Row = { x: p.value };
          scenario.rivals.forEach((_, i) => (row[`r${i}`] = pick(p.equilibrium, i)));
          return row;
        })
      : [];
  const series = scenario.rivals.map((r, i) => ({
    key: `r${i}`,
    name: r.name,
    colour: seriesColour(i),
  }));
  const isMoney = metric !== "shadow";
  const yLabel = metrics.find((m) => m.value === metric)?.label ?? metric;
  return (
    <section className="card" aria-labelledby="fronts-sweep-title">
      <h2 id="fronts-sweep-title">Sweep a front or rival parameter</h2>
      <div className="row" style={{ alignItems: "flex-end", flexWrap: "wrap" }}>
        <SelectField
          label="Parameter"
          value={param}
          options={options}
          onChange={(v) => {
            setParam(v);
            setFrom("");
            setTo("");
          }}
          testId="fronts-sweep-param"
        />
        <TextField
          label="From"
          numeric
          value={fromText}
          onChange={setFrom}
          width="8rem"
          testId="fronts-sweep-from"
        />
        <TextField
          label="To"
          numeric
          value={toText}
          onChange={setTo}
          width="8rem"
          testId="fronts-sweep-to"
        />
        <TextField
          label={`Points (2-${STEPS_MAX})`}
          numeric
          value={steps}
          onChange={setSteps}
          width="8rem"
          testId="fronts-sweep-steps"
        />
        <SelectField
          label="Show"
          value={metric}
          options={metrics}
          onChange={setMetric}
          testId="fronts-sweep-metric"
        />
        <div className="field">
          <button type="button" onClick={run} data-testid="fronts-sweep-run">
            Run sweep
          </button>
        </div>
      </div>
      {result && "error" in result && (
        <p className="field-error" role="alert">
          {result.error}
        </p>
      )}
      {rows.length > 0 && result && "label" in result && (
        <>
          <LineSeriesChart
            rows={rows}
            xKey="x"
            series={series}
            xLabel={result.label}
            yLabel={
              isMoney
                ? `${yLabel} (${scenario.currency ?? "money"})`
                : `${yLabel} (per unit of money)`
            }
            formatY={(v) => formatNumber(v)}
            formatX={(v) => formatNumber(v)}
            testId="fronts-sweep-chart"
          />
          <DataTable
            rows={rows}
            caption={`${yLabel} along ${result.label}; blank where no pure equilibrium was found`}
            testId="fronts-sweep-table"
            columns={[
              { key: "x", label: result.label, format: (v) => formatNumber(v) },
              ...scenario.rivals.map((r, i) => ({
                key: `r${i}`,
                label: r.name,
                format: isMoney ? money : (v: number) => formatNumber(v, 3),
              })),
            ]}
          />
        </>
      )}
    </section>
  );
}
