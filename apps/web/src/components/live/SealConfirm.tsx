import type { ReactNode } from "react";

/**
 * The confirmation step of sealing a move (a spend, or a split over fronts): what is about to
 * be sealed, Confirm and a way back; the seal's error below it.
 */
export function SealConfirm({
  children,
  busy,
  canSeal,
  onConfirm,
  onCancel,
  cancelLabel,
}: {
  /** what is about to be sealed, in words (the `confirm-text` paragraph and any list after it) */
  children: ReactNode;
  busy: boolean;
  canSeal: boolean;
  onConfirm: () => void;
  onCancel: () => void;
  cancelLabel: string;
}) {
  return (
    <div
      className="notice"
      role="alertdialog"
      aria-labelledby="confirm-text"
      data-testid="seal-confirm"
    >
      {children}
      <div className="row">
        <button
          type="button"
          className="primary"
          onClick={onConfirm}
          disabled={busy || !canSeal}
          data-testid="seal-confirm-button"
          autoFocus
        >
          {busy ? "Sealing…" : "Confirm"}
        </button>
        <button type="button" onClick={onCancel} disabled={busy} data-testid="seal-cancel-button">
          {cancelLabel}
        </button>
      </div>
    </div>
  );
}
