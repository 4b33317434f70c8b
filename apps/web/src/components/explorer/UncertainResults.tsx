"use client";

import { useState } from "react";
import type { UncertainResult, UncertainScenario } from "@contend/solver";
import { formatMoney, formatNumber, formatPercent } from "../../lib/format";
import { FigureTable, numCol, RowHeader, textCol } from "../FigureTable";
import { SelectField } from "../Field";
import { BandChart, isNum } from "./BandChart";
import { PlanPanel } from "./PlanPanel";
import { TornadoChart } from "./TornadoChart";

/** What a Monte Carlo run shows: bands, drop-out odds, the tornado and the robust plan. */
export function UncertainResults({
  result,
  scenario,
  label,
  ms,
}: {
  result: UncertainResult;
  scenario: UncertainScenario;
  label: (path: string) => string;
  ms: number;
}) {
  const cur = scenario.currency ?? null;
  const money = (x: number) => formatMoney(x, cur);
  const names = scenario.rivals.map((r) => r.name);
  const [rival, setRival] = useState(String(result.plan?.index ?? 0));
  const ri = Math.min(Number(rival), names.length - 1);
  const isMoney = (path: string) => /^(prize|rivals\.\d+\.(value|budget))$/.test(path);
  return (
    <div className="stack" data-testid="uncertain-results">
      <p className="small muted" data-testid="uncertain-status">
        {formatNumber(result.draws, 0)} draws (seed {result.seed}) in {formatNumber(ms, 0)} ms ·{" "}
        {formatPercent(result.noPureEquilibrium)} of draws have no pure-strategy equilibrium
        {result.noPureEquilibrium > 0 ? " and are left out of the bands" : ""}.
      </p>
      <div className="grid-3" style={{ alignItems: "start" }}>
        <BandChart
          title={`Spend (${cur || "money"})`}
          names={names}
          band={result.spends}
          format={money}
          testId="band-spend"
        />
        <BandChart
          title="Share"
          names={names}
          band={result.shares}
          format={(x) => formatPercent(x)}
          testId="band-share"
        />
        <BandChart
          title={`Payoff (${cur || "money"})`}
          names={names}
          band={result.payoffs}
          format={money}
          testId="band-payoff"
        />
      </div>
      <p className="small muted">Band: P10 to P90 of the draws · bar: median · ring: mean.</p>
      <FigureTable
        head={[
          textCol("Rival"),
          numCol("Spends something"),
          numCol("Drops out"),
          numCol("Median spend"),
          numCol("Median share"),
        ]}
        caption="How often each rival drops out (spends nothing) across the draws"
        testId="dropout-table"
      >
        {names.map((n, i) => {
          const a = result.activeProbability[i];
          return (
            <tr key={n}>
              <RowHeader>{n}</RowHeader>
              <td className="num">{!isNum(a) ? "–" : formatPercent(a)}</td>
              <td className="num">{!isNum(a) ? "–" : formatPercent(1 - a)}</td>
              <td className="num" data-testid={`uncertain-median-spend-${i}`}>
                {!isNum(result.spends.p50[i]) ? "–" : money(result.spends.p50[i]!)}
              </td>
              <td className="num">
                {!isNum(result.shares.p50[i]) ? "–" : formatPercent(result.shares.p50[i]!)}
              </td>
            </tr>
          );
        })}
      </FigureTable>
      {result.sensitivity.length > 0 && (
        <section aria-labelledby="tornado-title">
          <h3 id="tornado-title">Which unknown matters most</h3>
          <div className="row" style={{ alignItems: "flex-end" }}>
            <p className="small muted" style={{ flex: "1 1 20rem" }}>
              Equilibrium payoff with each parameter at its P90 minus at its P10, all others at
              their medians ({cur || "money"}).
            </p>
            <SelectField
              label="Payoff of"
              value={String(ri)}
              options={names.map((n, i) => ({ value: String(i), label: n }))}
              onChange={setRival}
              testId="tornado-rival"
            />
          </div>
          <TornadoChart
            rows={result.sensitivity}
            rival={ri}
            label={label}
            format={money}
            formatParam={(p, x) => (isMoney(p) ? money(x) : formatNumber(x))}
            rivalName={names[ri] ?? ""}
            unit={cur || "money"}
          />
        </section>
      )}
      {result.plan && (
        <section aria-labelledby="plan-title">
          <h3 id="plan-title">Robust plan</h3>
          <PlanPanel plan={result.plan} money={money} />
        </section>
      )}
    </div>
  );
}
