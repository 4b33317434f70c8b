"use client";

/**
 * The one-click "start a session" button beside a template or an explored scenario: it says
 * "Creating…" while its request is in flight and "Session created" once this very body has made
 * one (useCreateSession ignores a second click either way).
 */
export function CreateSessionButton({
  label,
  pending,
  created,
  disabled,
  onClick,
  testId,
}: {
  label: string;
  /** this button's request is in flight */
  pending: boolean;
  /** this button's body has made a session */
  created: boolean;
  /** any other reason to refuse a click (another request in flight, a field to fix) */
  disabled: boolean;
  onClick: () => void;
  testId: string;
}) {
  return (
    <button
      type="button"
      className="primary"
      onClick={onClick}
      disabled={disabled || created}
      data-testid={testId}
    >
      {pending ? "Creating…" : created ? "Session created" : label}
    </button>
  );
}
