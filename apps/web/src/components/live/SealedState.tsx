import type { ReactNode } from "react";
import type { RoleView } from "@contend/protocol";
import { LIMITS } from "@contend/protocol";
import type { useSession } from "../../hooks/useSession";

/** What a seat's move form is given: the seat's view, the way to send, whether it may seal now. */
export type MoveFormProps = {
  view: RoleView;
  send: ReturnType<typeof useSession>["send"];
  canSeal: boolean;
};

/**
 * What the seat has sealed for the open round (a spend, or a split over fronts), or that it has
 * not sealed yet, and whether the round is paused. `children` names what was sealed; it is shown
 * only when `sealed` is true.
 */
export function SealedState({
  sealed,
  paused,
  children,
}: {
  sealed: boolean;
  paused: boolean;
  children: ReactNode;
}) {
  return (
    <p className="small" data-testid="seat-sealed-state" aria-live="polite">
      {sealed ? (
        <>
          <span className="badge accent">sealed</span> You sealed {children}. You can replace it
          until the round closes.
        </>
      ) : (
        <span className="badge warn">not sealed yet</span>
      )}
      {paused ? (
        <span className="badge" style={{ marginLeft: 6 }}>
          paused
        </span>
      ) : null}
    </p>
  );
}

/** The seat's optional one-line reason for its move, kept to one line as it is typed. */
export function ReasonField({
  value,
  onChange,
  disabled,
}: {
  value: string;
  onChange: (reason: string) => void;
  disabled: boolean;
}) {
  return (
    <div className="field" style={{ flex: "2 1 16rem" }}>
      <label htmlFor="reason-input">
        Why (optional, one line; others see it only when the round is revealed)
      </label>
      <input
        id="reason-input"
        type="text"
        maxLength={LIMITS.reasonMax}
        value={value}
        onChange={(e) => onChange(e.target.value.replace(/[\r\n]+/g, " "))}
        disabled={disabled}
        data-testid="reason-input"
      />
    </div>
  );
}

/** The seal's error, if the last seal failed (announced as an alert). */
export function SealError({ error }: { error: string | null }) {
  return (
    <p className="field-error" role={error ? "alert" : undefined} data-testid="seal-error">
      {error ?? ""}
    </p>
  );
}
