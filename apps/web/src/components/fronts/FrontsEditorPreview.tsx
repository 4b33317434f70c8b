"use client";

import { useMemo } from "react";
import type { FrontsScenario } from "@contend/solver";
import { useFrontsSolve } from "../../hooks/useFrontsWorker";
import { formatMoney } from "../../lib/format";
import { defaultSweepSettings, encodeFronts } from "../../lib/frontsState";

/**
 * The session editor's preview in fronts mode: each rival's equilibrium split (money per front
 * and in total), solved in the fronts explorer's Web Worker, and a link to the whole analysis.
 */
export function FrontsEditorPreview({ scenario }: { scenario: FrontsScenario | null }) {
  const key = scenario ? JSON.stringify(scenario) : "";
  // keyed by content so that a re-render with the same numbers does not solve again
  const stable = useMemo(() => (key ? (JSON.parse(key) as FrontsScenario) : null), [key]);
  const solve = useFrontsSolve(stable);
  // nothing from earlier numbers while a field needs fixing (the answer would not be theirs)
  const shown =
    stable === null
      ? null
      : solve.status === "done"
        ? solve
        : solve.status === "solving"
          ? solve.previous
          : null;
  const cur = shown?.scenario.currency ?? null;
  return (
    <div data-testid="fronts-preview">
      <p className="small muted" aria-live="polite">
        {stable === null
          ? "Fix the fields marked in red to see the equilibrium."
          : solve.status === "solving"
            ? "Solving…"
            : ""}
      </p>
      {solve.status === "error" && <p className="field-error">{solve.message}</p>}
      {shown && shown.eq.spends === null && (
        <p data-testid="fronts-preview-none">
          {shown.eq.note ?? "No pure-strategy equilibrium found."}
        </p>
      )}
      {shown && shown.eq.spends !== null && (
        <div className="table-wrap">
          <table className="small" data-testid="fronts-preview-table">
            <caption className="small muted">
              Equilibrium spend per front{cur ? ` (${cur})` : " (money)"}
            </caption>
            <thead>
              <tr>
                <th scope="col">Rival</th>
                {shown.scenario.fronts.map((f) => (
                  <th key={f.name} scope="col">
                    {f.name}
                  </th>
                ))}
                <th scope="col">Total</th>
              </tr>
            </thead>
            <tbody>
              {shown.scenario.rivals.map((r, i) => {
                const row = shown.eq.spends![i] ?? [];
                return (
                  <tr key={r.name}>
                    <th scope="row">{r.name}</th>
                    {row.map((x, k) => (
                      <td key={k} className="num">
                        {formatMoney(x, cur)}
                      </td>
                    ))}
                    <td className="num">
                      {formatMoney(
                        row.reduce((a, b) => a + b, 0),
                        cur,
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
      {stable && (
        <a
          className="small"
          href={`/explore/fronts?s=${encodeFronts({ sc: stable, sw: defaultSweepSettings(stable) })}`}
        >
          Open these fronts in the fronts explorer (shares, shadow prices, sweeps)
        </a>
      )}
    </div>
  );
}
