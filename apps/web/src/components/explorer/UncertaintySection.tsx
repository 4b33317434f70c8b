"use client";

import { useMemo, useState } from "react";
import type { Scenario } from "@contend/solver";
import { useUncertainRun } from "../../hooks/useUncertainRun";
import { formatNumber } from "../../lib/format";
import type { BuiltUncertain, RangeField, RangeForm } from "../../lib/rangeForm";
import { SelectField, TextField } from "../Field";
import { readSeed, RunOrCancel, RunProgress, SeedField } from "../RunControls";
import { UncertainResults } from "./UncertainResults";
import { whole } from "../../lib/rangeForm";

const MAX_DRAWS_UI = 100_000;

/**
 * Uncertainty: switch any of the scenario's numbers to a range, run a seeded Monte Carlo of the
 * equilibrium in a Web Worker, and read outcome bands, drop-out odds, the tornado and one
 * rival's robust plan.
 */
export function UncertaintySection({
  scenario,
  ranges,
  built,
  fields,
}: {
  scenario: Scenario | null;
  ranges: RangeForm;
  built: BuiltUncertain | null;
  fields: RangeField[];
}) {
  const [drawsText, setDrawsText] = useState("10000");
  const [seedText, setSeedText] = useState("1");
  const [plan, setPlan] = useState("0");
  const { state, run, cancel } = useUncertainRun();
  const draws = whole(drawsText, 1, MAX_DRAWS_UI);
  const seed = readSeed(seedText);
  const names = scenario?.rivals.map((r) => r.name) ?? [];
  const labelOf = useMemo(() => {
    const m = new Map(fields.map((f) => [f.path, f.label]));
    return (p: string) => m.get(p) ?? p;
  }, [fields]);
  const canRun = built?.ok === true && built.count > 0 && draws !== null && seed !== null;
  const start = () => {
    if (!canRun || !built.ok) return;
    const p = Number(plan);
    run(built.scenario, {
      draws: draws!,
      seed: seed!,
      planRival: p >= 0 && p < names.length ? p : null,
    });
  };

  return (
    <section className="card" aria-labelledby="uncertain-title" data-testid="uncertainty-section">
      <h2 id="uncertain-title">Uncertainty: ranges, bands and a robust plan</h2>
      <p className="small muted">
        Tick range under any number above that you only know as a range. Each draw picks every range
        independently, solves the equilibrium, and the bands show where spend, share and payoff
        land. A model of what you do not know, not a forecast; keep plans internal and never share
        them with competitors.
      </p>
      {scenario === null ? (
        <p className="muted">Fix the highlighted fields first.</p>
      ) : (
        <div data-testid="range-summary">
          {fields.filter((f) => ranges[f.path]?.on).length === 0 ? (
            <p className="small">
              Tick <strong>range</strong> under the prize or any rival&apos;s cost, value, weight or
              budget above to give it a range.
            </p>
          ) : (
            <ul className="small">
              {fields
                .filter((f) => ranges[f.path]?.on)
                .map((f) => {
                  const r = ranges[f.path]!;
                  return (
                    <li key={f.path}>
                      {f.label}
                      {f.unit === "money" ? ` (${scenario.currency || "money"})` : ""}:{" "}
                      {r.dist === "uniform"
                        ? `uniform ${r.low} to ${r.high}`
                        : `triangular ${r.low} to ${r.high}, most likely ${r.mode}`}
                    </li>
                  );
                })}
            </ul>
          )}
          {built && !built.ok && (
            <p className="field-error" role="alert">
              {built.message}
            </p>
          )}
        </div>
      )}
      <div className="row" style={{ alignItems: "flex-start", marginTop: "0.75rem" }}>
        <TextField
          label="Draws"
          numeric
          width="8rem"
          value={drawsText}
          onChange={setDrawsText}
          testId="uncertain-draws"
          error={
            draws === null ? `a whole number from 1 to ${formatNumber(MAX_DRAWS_UI, 0)}` : undefined
          }
        />
        <SeedField text={seedText} onChange={setSeedText} testId="uncertain-seed" />
        <SelectField
          label="Robust plan for"
          value={plan}
          options={[
            { value: "-1", label: "No plan" },
            ...names.map((n, i) => ({ value: String(i), label: n })),
          ]}
          onChange={setPlan}
          testId="uncertain-plan"
        />
        <RunOrCancel
          running={state.status === "running"}
          onRun={start}
          onCancel={cancel}
          runLabel="Run draws"
          testId="uncertain"
          disabled={!canRun}
          primary
        />
      </div>
      <div style={{ minHeight: "2.2rem" }} aria-live="polite">
        {built?.ok && built.count === 0 && (
          <p className="small muted">Switch at least one number to a range to run draws.</p>
        )}
        <RunProgress state={state} label="Draws done" unit="draws" testId="uncertain" />
        {state.status === "error" && <p className="field-error">{state.message}</p>}
      </div>
      {state.status === "done" && (
        <UncertainResults
          result={state.result}
          scenario={state.scenario}
          label={labelOf}
          ms={state.ms}
        />
      )}
    </section>
  );
}
