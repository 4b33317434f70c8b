"use client";

import type { Parsed, Scenario, StaticsResult } from "@contend/solver";
import { formatNumber, formatSigned } from "../../lib/format";
import { FigureTable, numCol, RowHeader, textCol } from "../FigureTable";

/**
 * How each rival's equilibrium effort responds to a small change in each parameter, for
 * simultaneous moves. Beyond the solver's rival limit the section says so. While a newer
 * scenario is being solved, the last table stays, greyed.
 */
export function StaticsSection({
  scenario,
  statics,
  solving,
}: {
  scenario: Scenario | null;
  /** Computed with the equilibrium in the explorer's worker (staticsForView). */
  statics: Parsed<StaticsResult> | null;
  /** A newer scenario is being solved: the table is for the previous one, shown greyed. */
  solving: boolean;
}) {
  return (
    <section className="card" aria-labelledby="statics-title">
      <h2 id="statics-title">Comparative statics</h2>
      <p className="small muted">
        How each rival&apos;s equilibrium effort responds to a small change in one parameter: the
        derivative, and the elasticity (percent change in effort per percent change in the
        parameter). How each row is computed is under &ldquo;About the maths&rdquo; below.
      </p>
      <div className={solving ? "eq-stale" : undefined} aria-busy={solving}>
        {statics === null ? (
          <p className="muted">
            {scenario?.leader
              ? "Shown for simultaneous moves only."
              : scenario
                ? "Solving…"
                : "Fix the highlighted fields first."}
          </p>
        ) : !statics.ok ? (
          <p className="muted" data-testid="statics-unavailable">
            {statics.message}
          </p>
        ) : (
          <FigureTable
            head={[
              textCol("Parameter"),
              numCol("At"),
              ...statics.value.names.map((n) =>
                numCol(
                  <>
                    d effort {n} <span className="muted">(elasticity)</span>
                  </>,
                  `d effort ${n}`,
                ),
              ),
              numCol("d total"),
              textCol("Method"),
            ]}
            testId="statics-table"
          >
            {statics.value.rows.map((row) => (
              <tr key={row.param}>
                <RowHeader>{row.label}</RowHeader>
                <td className="num">{formatNumber(row.at)}</td>
                {row.effort.d.map((d, i) => (
                  <td key={i} className="num" data-testid={`statics-${row.param}-effort-${i}`}>
                    {formatSigned(d)}{" "}
                    <span className="muted">
                      (
                      {row.effort.elasticity[i] === null
                        ? "\u2013"
                        : formatSigned(row.effort.elasticity[i] as number, 2)}
                      )
                    </span>
                  </td>
                ))}
                <td className="num">{formatSigned(row.totalEffort.d)}</td>
                <td>
                  <span className="badge">{row.method}</span>
                  {row.note ? <span className="small muted"> {row.note}</span> : null}
                </td>
              </tr>
            ))}
          </FigureTable>
        )}
      </div>
    </section>
  );
}
