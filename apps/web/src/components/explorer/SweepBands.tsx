"use client";

import { useMemo, useState } from "react";
import { MAX_STEPS_1D, planAxis } from "@contend/solver";
import type { AxisSpec, BandSweep, Parsed, Scenario, UncertainScenario } from "@contend/solver";
import { useUncertainWorker } from "../../hooks/useUncertainWorker";
import { bandHighKey, bandLowKey, bandMidKey, bandRows, worstNoPure } from "../../lib/bandRows";
import { formatMoney, formatNumber, formatPercent, formatPlain } from "../../lib/format";
import { whole } from "../../lib/rangeForm";
import { DataTable } from "../DataTable";
import { TextField } from "../Field";
import { readSeed, RunOrCancel, RunProgress, SeedField } from "../RunControls";
import { BandSweepChart } from "./BandSweepChart";

/** Most draws x points one run may ask for (about 20 s for ten rivals on a laptop). */
const MAX_SOLVES = 1_000_000;
const exact = (v: number) => String(Number(v.toPrecision(6)));

/**
 * Bands along the sweep, for a scenario with ranges: at each swept value the Monte Carlo of the
 * equilibrium (the same seed at every value), P10-P90 of each rival's spend and payoff with the
 * median. Runs in the uncertainty worker with progress and cancel.
 */
export function SweepBands({
  scenario,
  uncertain,
  spec,
  paramLabel,
}: {
  scenario: Scenario;
  uncertain: UncertainScenario;
  spec: AxisSpec;
  paramLabel: string;
}) {
  const [drawsText, setDrawsText] = useState("400");
  const [seedText, setSeedText] = useState("1");
  const { state, start, cancel } = useUncertainWorker<Parsed<BandSweep>>();
  const axis = useMemo(() => planAxis(scenario, spec, "sweep", MAX_STEPS_1D), [scenario, spec]);
  const draws = whole(drawsText, 10, 100_000);
  const seed = readSeed(seedText);
  const points = axis.ok ? axis.value.values.length : 0;
  const tooMany = draws !== null && points * draws > MAX_SOLVES;
  const canRun = axis.ok && draws !== null && seed !== null && !tooMany;
  const names = scenario.rivals.map((r) => r.name);
  const currency = scenario.currency ?? null;
  const money = (v: number) => formatMoney(v, currency);
  const unit = currency ? ` (${currency})` : "";

  function run() {
    if (!axis.ok || draws === null || seed === null) return;
    const req = { param: axis.value.param, values: axis.value.values, draws, seed };
    start(points, (api, onProgress) => api.sweep(uncertain, req, onProgress));
  }

  const done = state.status === "done" && state.value.ok ? state.value.value : null;
  const spends = useMemo(() => (done ? bandRows(done, "spends") : null), [done]);
  const payoffs = useMemo(() => (done ? bandRows(done, "payoffs") : null), [done]);
  return (
    <div data-testid="sweep-bands">
      <h3>Bands over the ranges</h3>
      <p className="small muted">
        The scenario has ranges: at each value of {paramLabel} the equilibrium is solved for every
        draw (the same draws at every value), and each rival&apos;s spend and payoff is shown as a
        band from the 10th to the 90th percentile with a line at the median.
      </p>
      <div className="row" style={{ alignItems: "flex-start" }}>
        <TextField
          label="Draws per value"
          numeric
          width="9rem"
          value={drawsText}
          onChange={setDrawsText}
          testId="bands-draws"
          error={
            draws === null
              ? "a whole number from 10 to 100,000"
              : tooMany
                ? `${formatNumber(points * draws, 0)} solves; at most ${formatNumber(MAX_SOLVES, 0)}: fewer points or draws`
                : undefined
          }
        />
        <SeedField text={seedText} onChange={setSeedText} testId="bands-seed" />
        <RunOrCancel
          running={state.status === "running"}
          onRun={run}
          onCancel={cancel}
          runLabel="Run bands"
          testId="bands"
          disabled={!canRun}
        />
      </div>
      <div style={{ minHeight: "2.2rem" }} aria-live="polite">
        <RunProgress state={state} label="Sweep values done" unit="values" testId="bands" />
        {state.status === "error" && <p className="field-error">{state.message}</p>}
        {state.status === "done" && !state.value.ok && (
          <p className="field-error">
            {state.value.path}: {state.value.message}
          </p>
        )}
        {done && state.status === "done" && (
          <p className="small muted" data-testid="bands-summary">
            {done.points.length} values x {formatNumber(done.draws, 0)} draws (seed {done.seed}) in{" "}
            {formatNumber(state.ms, 0)} ms. Draws without a pure equilibrium are left out of the
            bands: at most {formatPercent(worstNoPure(done))} at any value.
          </p>
        )}
      </div>
      {done && spends && payoffs && (
        <>
          <div className="grid-2">
            <div>
              <h4>Spend (money)</h4>
              <BandSweepChart
                rows={spends.chart}
                names={names}
                xLabel={paramLabel}
                yLabel={`Spend${currency ? ` (${currency})` : ""}`}
                formatX={(v) => formatPlain(v, 3)}
                formatY={money}
                testId="bands-spend-chart"
                slide={{
                  title: `Equilibrium spend with its range as ${paramLabel} varies`,
                  caption: `Each rival's equilibrium spend over the Monte Carlo draws of the uncertain inputs, at each value of ${paramLabel}: the line is the median, the shaded band runs from the 10th to the 90th percentile. A model's spread, not a forecast.`,
                }}
              />
            </div>
            <div>
              <h4>Payoff (money)</h4>
              <BandSweepChart
                rows={payoffs.chart}
                names={names}
                xLabel={paramLabel}
                yLabel={`Payoff${currency ? ` (${currency})` : ""}`}
                formatX={(v) => formatPlain(v, 3)}
                formatY={money}
                testId="bands-payoff-chart"
                slide={{
                  title: `Equilibrium payoff with its range as ${paramLabel} varies`,
                  caption: `Each rival's equilibrium payoff over the Monte Carlo draws of the uncertain inputs, at each value of ${paramLabel}: the line is the median, the shaded band runs from the 10th to the 90th percentile. A model's spread, not a forecast.`,
                }}
              />
            </div>
          </div>
          <DataTable
            caption={`Spend (money) against ${paramLabel}: 10th, 50th and 90th percentile over the draws`}
            testId="bands-table"
            rows={spends.table}
            columns={[
              { key: "x", label: paramLabel, format: exact },
              ...names.flatMap((n, i) => [
                { key: bandLowKey(i), label: `${n} P10${unit}`, format: exact },
                { key: bandMidKey(i), label: `${n} P50${unit}`, format: exact },
                { key: bandHighKey(i), label: `${n} P90${unit}`, format: exact },
              ]),
            ]}
          />
        </>
      )}
    </div>
  );
}
