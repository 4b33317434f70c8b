import type { Calibration } from "@contend/solver";
import { formatMoney, formatNumber } from "../../lib/format";
import { FigureTable, numCol, textCol } from "../FigureTable";
import { Kpi } from "../Kpi";

const num = (x: number) => formatNumber(x, Math.abs(x) >= 10 ? 2 : 3);

/** The estimates with their intervals and the fit quality. */
export function CalibrationResults({ c, currency }: { c: Calibration; currency: string | null }) {
  const money = (x: number) => formatMoney(x, currency);
  const d = c.decisiveness;
  return (
    <div>
      <div className="kpis">
        <Kpi label="Decisiveness r (95% interval)" testId="calibrate-r">
          {num(d.estimate)}{" "}
          <span className="small muted">
            ({num(d.low)} to {num(d.high)})
          </span>
        </Kpi>
        <Kpi label="R² (log-centred)" testId="calibrate-r2">
          {formatNumber(c.fit.r2, 3)}
        </Kpi>
        <Kpi label="Share RMSE" testId="calibrate-rmse">
          {formatNumber(c.fit.rmse * 100, 2)} pp
        </Kpi>
        <Kpi label="Observations / periods / dropped" testId="calibrate-counts">
          {c.fit.observations} / {c.fit.periods} / {c.fit.dropped}
        </Kpi>
      </div>
      <FigureTable
        head={[
          textCol("Rival"),
          numCol(
            <>
              Head start
              <br />
              <span className="small">95% interval</span>
            </>,
            "head",
          ),
          numCol(
            <>
              Revealed value
              <br />
              <span className="small">90% interval</span>
            </>,
            "value",
          ),
        ]}
        caption={`Head starts relative to ${c.rivals[0]} (= 1). Revealed value: what winning was worth per period if spends were best replies, median over periods; interval from a bootstrap over periods (${c.bootstrap.resamples} resamples, seed ${c.bootstrap.seed}).`}
        testId="calibrate-table"
      >
        {c.rivals.map((name, i) => {
          const h = c.headStarts[i]!;
          const v = c.revealedValues[i]!;
          return (
            <tr key={name}>
              <td>{name}</td>
              <td className="num">
                <span data-testid={`calibrate-head-${i}`}>{num(h.estimate)}</span>
                <br />
                <span className="small muted" style={{ whiteSpace: "normal" }}>
                  {i === 0 ? "baseline" : `${num(h.low)} to ${num(h.high)}`}
                </span>
              </td>
              <td className="num">
                <span data-testid={`calibrate-value-${i}`}>{money(v.estimate)}</span>
                <br />
                <span className="small muted" style={{ whiteSpace: "normal" }}>
                  {money(v.low)} to {money(v.high)}
                </span>
              </td>
            </tr>
          );
        })}
      </FigureTable>
      <p className="small muted">
        {c.fit.residualDf} residual degrees of freedom (observations − periods − rivals). Rows with
        zero spend or zero share cannot enter the log model and are counted as dropped.
      </p>
    </div>
  );
}
