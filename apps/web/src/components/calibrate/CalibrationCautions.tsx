import { CALIBRATION_CAUTIONS } from "@contend/solver";

/** What calibration assumes, beside its results; the general cautions stay in the footer. */
export function CalibrationCautions() {
  return (
    <aside
      className="caution"
      aria-labelledby="calibration-caution"
      data-testid="calibrate-cautions"
    >
      <strong id="calibration-caution">Estimates, not facts</strong>
      <ul>
        {CALIBRATION_CAUTIONS.map((line) => (
          <li key={line}>{line}</li>
        ))}
        <li>
          A stylised model to aid thinking, not a forecast or advice. Keep the data and the war-game
          internal: never share plans or budgets with actual competitors.
        </li>
      </ul>
    </aside>
  );
}
