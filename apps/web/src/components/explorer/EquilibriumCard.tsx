"use client";

import { formatMoney, formatPercent } from "../../lib/format";
import type { SolvedView } from "../../lib/solveView";
import { SolvedEquilibrium } from "../EquilibriumTable";
import { MixedStrategyChart } from "./MixedStrategyChart";
import { Term } from "../Glossary";

function statusLine(solving: boolean, hasAnswer: boolean, ms: number | null): string {
  if (solving)
    return hasAnswer ? "Solving… the answer below is for the previous numbers." : "Solving…";
  return ms === null ? "" : `Solved in ${Math.round(ms)} ms in a background worker.`;
}

/**
 * The solved scenario (or the leader-follower outcome) with any further equilibria listed.
 * While a newer scenario is being solved the last answer stays, greyed, under a "Solving…" note.
 */
export function EquilibriumCard({
  solved,
  solving,
  ms,
  currency,
  sequential,
}: {
  solved: SolvedView | null;
  /** A newer scenario is being solved: `solved` is the last answer, shown greyed. */
  solving: boolean;
  /** How long the last solve took in the worker, once it is done. */
  ms: number | null;
  currency: string | null;
  sequential: boolean;
}) {
  const money = (v: number) => formatMoney(v, currency);
  return (
    <section
      className="card"
      aria-labelledby="eq-title"
      aria-busy={solving}
      data-testid="eq-card"
      data-solving={solving ? "yes" : "no"}
    >
      <h2 id="eq-title">{sequential ? "Leader-follower outcome" : <Term id="equilibrium" />}</h2>
      <p className="small muted" data-testid="eq-status" aria-live="polite">
        {statusLine(solving, solved !== null, ms)}
      </p>
      <div className={solving ? "eq-stale" : undefined}>
        <SolvedEquilibrium
          solved={solved}
          currency={currency}
          testPrefix="eq"
          more={(ok) => (
            <>
              <MixedStrategyChart
                contest={ok.contest}
                equilibrium={ok.result.equilibrium}
                currency={currency}
              />
              {ok.result.alternatives.length > 0 && (
                <div data-testid="eq-alternatives">
                  <h3>Further equilibria</h3>
                  {ok.result.alternatives.map((alt, k) => (
                    <p key={k} className="small">
                      {k + 2}. spends{" "}
                      {(alt.efforts ?? alt.expectedEfforts ?? [])
                        .map((e, i) => money(e * (ok.contest.rivals[i]?.cost ?? Number.NaN)))
                        .join(", ")}{" "}
                      · <Term id="dissipation">share of the prize spent</Term>{" "}
                      {formatPercent(alt.dissipation)}
                    </p>
                  ))}
                </div>
              )}
            </>
          )}
        />
      </div>
    </section>
  );
}
