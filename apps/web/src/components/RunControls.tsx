import { whole } from "../lib/rangeForm";
import { TextField } from "./Field";
import { ProgressBar } from "./ProgressBar";

/** What the run controls read of a Web Worker job's state (every job hook's state fits it). */
export type RunPhase =
  | { status: "idle"; cancelled?: boolean }
  | { status: "running"; done: number; total: number }
  | { status: "done" | "error" };

/** The largest seed a Monte Carlo run takes (a 32-bit unsigned whole number). */
export const MAX_SEED = 2 ** 32 - 1;

/** A Monte Carlo run's seed as typed: a whole number from 0 to MAX_SEED, or null. */
export function readSeed(text: string): number | null {
  return whole(text, 0, MAX_SEED);
}

/** The seed of a Monte Carlo run, named at its field when it is not one. */
export function SeedField({
  text,
  onChange,
  testId,
}: {
  text: string;
  onChange: (text: string) => void;
  testId: string;
}) {
  return (
    <TextField
      label="Seed"
      numeric
      width="8rem"
      value={text}
      onChange={onChange}
      testId={testId}
      error={readSeed(text) === null ? `a whole number from 0 to ${MAX_SEED}` : undefined}
    />
  );
}

/**
 * Run, or Cancel while the job runs, in a field cell aligned with the labelled fields beside
 * it. Test ids `<testId>-run` and `<testId>-cancel`.
 */
export function RunOrCancel({
  running,
  onRun,
  onCancel,
  runLabel,
  testId,
  disabled,
  primary,
}: {
  running: boolean;
  onRun: () => void;
  onCancel: () => void;
  runLabel: string;
  testId: string;
  disabled?: boolean;
  primary?: boolean;
}) {
  return (
    <div className="field">
      <span aria-hidden="true">&nbsp;</span>
      {running ? (
        <button type="button" onClick={onCancel} data-testid={`${testId}-cancel`}>
          Cancel
        </button>
      ) : (
        <button
          type="button"
          className={primary ? "primary" : undefined}
          onClick={onRun}
          disabled={disabled}
          data-testid={`${testId}-run`}
        >
          {runLabel}
        </button>
      )}
    </div>
  );
}

/**
 * A job's progress bar while it runs, and a line saying it was cancelled after a cancel. Test
 * ids `<testId>-progress` and `<testId>-cancelled`.
 */
export function RunProgress({
  state,
  label,
  unit,
  testId,
  cancelled = "Cancelled.",
}: {
  state: RunPhase;
  /** the progress bar's accessible name */
  label: string;
  /** what is counted, shown as "done of total <unit>" */
  unit: string;
  testId: string;
  /** the line shown after a cancel */
  cancelled?: string;
}) {
  return (
    <>
      {state.status === "running" && (
        <ProgressBar
          done={state.done}
          total={state.total}
          label={label}
          unit={unit}
          testId={`${testId}-progress`}
        />
      )}
      {state.status === "idle" && state.cancelled && (
        <p className="small muted" data-testid={`${testId}-cancelled`}>
          {cancelled}
        </p>
      )}
    </>
  );
}
