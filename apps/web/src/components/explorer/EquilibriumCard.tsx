"use client";

import { formatMoney, formatPercent } from "../../lib/format";
import type { SolvedView } from "../../lib/solveView";
import { SolvedEquilibrium } from "../EquilibriumTable";
import { MixedStrategyChart } from "./MixedStrategyChart";
import { Term } from "../Glossary";

/** The solved scenario (or the leader-follower outcome) with any further equilibria listed. */
export function EquilibriumCard({
  solved,
  currency,
  sequential,
}: {
  solved: SolvedView | null;
  currency: string | null;
  sequential: boolean;
}) {
  const money = (v: number) => formatMoney(v, currency);
  return (
    <section className="card" aria-labelledby="eq-title">
      <h2 id="eq-title">{sequential ? "Leader-follower outcome" : <Term id="equilibrium" />}</h2>
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
    </section>
  );
}
