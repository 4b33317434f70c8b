import { formatNumber } from "../lib/format";

/** A labelled progress bar with "done of total <unit>" under it (sweeps, Monte Carlo draws). */
export function ProgressBar({
  done,
  total,
  label,
  unit,
  testId,
}: {
  done: number;
  total: number;
  label: string;
  unit: string;
  testId: string;
}) {
  return (
    <div data-testid={testId}>
      <div
        className="progress"
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={total}
        aria-valuenow={done}
      >
        <div style={{ width: `${(100 * done) / Math.max(1, total)}%` }} />
      </div>
      <span className="small muted">
        {formatNumber(done, 0)} of {formatNumber(total, 0)} {unit}
      </span>
    </div>
  );
}
