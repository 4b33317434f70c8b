import type { ReactNode } from "react";
import type { Contest, Equilibrium } from "@contend/solver";
import { formatMoney, formatNumber, formatPercent } from "../lib/format";
import type { SolvedView } from "../lib/solveView";
import { Kpi } from "./Kpi";
import { FigureTable, numCol, RowHeader, textCol } from "./FigureTable";
import { Term } from "./Glossary";

const KIND_TEXT: Record<Equilibrium["kind"], string> = {
  pure: "Pure-strategy equilibrium",
  mixed: "Mixed-strategy equilibrium (expected values)",
  "none-pure": "No pure-strategy equilibrium found",
};

/**
 * Equilibrium spends (money), efforts (the model's units: spend / cost), shares and payoffs per
 * rival. Rows keep their height whether or not a
 * result is present, so the page does not jump while typing.
 */
export function EquilibriumTable({
  contest,
  equilibrium,
  currency,
  testPrefix = "eq",
  caption,
}: {
  contest: Contest;
  equilibrium: Equilibrium | null;
  currency: string | null | undefined;
  testPrefix?: string;
  caption?: string;
}) {
  const eq = equilibrium;
  const efforts = eq ? (eq.efforts ?? eq.expectedEfforts ?? null) : null;
  return (
    <div>
      <p className="small" data-testid={`${testPrefix}-kind`} style={{ minHeight: "1.5em" }}>
        {eq ? KIND_TEXT[eq.kind] : "\u00a0"}
      </p>
      <FigureTable
        head={[
          textCol("Rival"),
          numCol("Effort (spend ÷ cost)"),
          numCol("Spend"),
          numCol("Share"),
          numCol("Payoff"),
          textCol("Status"),
        ]}
        caption={caption}
      >
        {contest.rivals.map((r, i) => {
          const e = efforts?.[i];
          const active = eq?.active[i] ?? false;
          return (
            <tr key={`${r.name}-${i}`} className={eq && !active ? "dropout" : undefined}>
              <RowHeader>{r.name}</RowHeader>
              <td className="num" data-testid={`${testPrefix}-effort-${i}`}>
                {e === undefined ? "\u2013" : formatNumber(e)}
              </td>
              <td className="num" data-testid={`${testPrefix}-spend-${i}`}>
                {e === undefined ? "\u2013" : formatMoney(e * r.cost, currency)}
              </td>
              <td className="num" data-testid={`${testPrefix}-share-${i}`}>
                {eq?.shares ? formatPercent(eq.shares[i] ?? NaN) : "\u2013"}
              </td>
              <td className="num" data-testid={`${testPrefix}-payoff-${i}`}>
                {eq?.payoffs ? formatMoney(eq.payoffs[i] ?? NaN, currency) : "\u2013"}
              </td>
              <td data-testid={`${testPrefix}-status-${i}`}>
                {!eq || efforts === null ? (
                  "\u2013"
                ) : active ? (
                  <span className="badge accent">active</span>
                ) : (
                  <span className="badge off">drops out</span>
                )}
                {Number.isFinite(r.maxEffort) &&
                e !== undefined &&
                e >= r.maxEffort * (1 - 1e-9) ? (
                  <span className="badge warn" style={{ marginLeft: 4 }}>
                    at budget
                  </span>
                ) : null}
              </td>
            </tr>
          );
        })}
      </FigureTable>
      <div className="kpis" style={{ marginTop: "0.75rem" }}>
        <Kpi label="Total spend" testId={`${testPrefix}-total`}>
          {eq && efforts
            ? formatMoney(
                efforts.reduce((sum, e, i) => sum + e * (contest.rivals[i]?.cost ?? NaN), 0),
                currency,
              )
            : "\u2013"}
        </Kpi>
        <Kpi
          label={<Term id="dissipation">Share of the prize spent</Term>}
          testId={`${testPrefix}-dissipation`}
        >
          {eq && efforts ? formatPercent(eq.dissipation) : "\u2013"}
        </Kpi>
        <Kpi
          label={
            <>
              Check: largest <Term id="regret">regret</Term> (should be 0)
            </>
          }
          testId={`${testPrefix}-gap`}
        >
          {eq && efforts ? formatMoney(eq.nashGap, currency) : "\u2013"}
        </Kpi>
      </div>
      <p className="small muted" style={{ minHeight: "1.5em" }} data-testid={`${testPrefix}-note`}>
        {eq?.note ?? ""}
      </p>
    </div>
  );
}

/**
 * The equilibrium of a scenario being edited: a hint while fields are invalid, the table, or the
 * solver's failure. `more` adds what one screen shows under the table.
 */
export function SolvedEquilibrium({
  solved,
  currency,
  testPrefix,
  more,
}: {
  solved: SolvedView | null;
  currency: string | null | undefined;
  testPrefix: string;
  more?: (ok: Extract<SolvedView, { ok: true }>) => ReactNode;
}) {
  if (solved === null) {
    return (
      <p className="muted" data-testid={`${testPrefix}-empty`}>
        Fix the highlighted fields to see the equilibrium.
      </p>
    );
  }
  if (!solved.ok) return <p className="notice error">{solved.message}</p>;
  return (
    <>
      <EquilibriumTable
        contest={solved.contest}
        equilibrium={solved.result.equilibrium}
        currency={currency}
        testPrefix={testPrefix}
      />
      {more?.(solved)}
    </>
  );
}
