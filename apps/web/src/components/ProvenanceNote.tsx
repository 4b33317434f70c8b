/**
 * A scenario's provenance: the calibration its numbers came from, with the intervals and the
 * cautions. Shown in the editor (where the calibration is kept into the session) and the debrief.
 */
import { CALIBRATION_CAUTIONS, type Provenance } from "@contend/solver";
import { formatMoney, formatNumber } from "../lib/format";
import { FigureTable, numCol, textCol } from "./FigureTable";

export function ProvenanceNote({
  provenance: p,
  currency,
  testId = "provenance",
}: {
  provenance: Provenance;
  currency: string | null;
  testId?: string;
}) {
  const num = (x: number) => formatNumber(x, x >= 10 ? 2 : 3);
  const money = (x: number) => formatMoney(x, currency);
  return (
    <section
      className="notice provenance"
      data-testid={testId}
      aria-label="Where these numbers came from"
    >
      <p style={{ marginTop: 0 }}>
        <strong>Calibrated from data:</strong> {p.source || "pasted data"}, {p.fit.observations}{" "}
        observations in {p.fit.periods} periods ({p.fit.dropped} rows dropped); R²{" "}
        {formatNumber(p.fit.r2, 3)}, share RMSE {formatNumber(p.fit.rmse * 100, 2)} percentage
        points. Decisiveness r = {num(p.decisiveness.estimate)} (95% interval{" "}
        {num(p.decisiveness.low)} to {num(p.decisiveness.high)}).
      </p>
      <FigureTable
        head={[
          textCol("Rival"),
          numCol("Head start (95% interval)"),
          numCol("Revealed value (90% interval)"),
        ]}
        caption="Estimates behind the weights and values (head starts relative to the first rival)"
        testId={`${testId}-table`}
      >
        {p.headStarts.map((h, i) => {
          const v = p.revealedValues[i];
          return (
            <tr key={h.rival}>
              <td>{h.rival}</td>
              <td className="num">
                {i === 0 ? "1 (baseline)" : `${num(h.estimate)} (${num(h.low)} to ${num(h.high)})`}
              </td>
              <td className="num">
                {v ? `${money(v.estimate)} (${money(v.low)} to ${money(v.high)})` : "\u2013"}
              </td>
            </tr>
          );
        })}
      </FigureTable>
      <ul className="small" style={{ marginBottom: 0 }}>
        {CALIBRATION_CAUTIONS.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
    </section>
  );
}
