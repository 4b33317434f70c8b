/**
 * Delete… on a library row; once pressed, the question in its place with Delete (for good) and
 * Keep. Test ids: `testIds.ask` on Delete…, `testIds.confirm` on Delete.
 */
export function ConfirmDelete({
  confirming,
  question,
  onAsk,
  onDelete,
  onKeep,
  busy,
  testIds,
}: {
  confirming: boolean;
  /** what deleting erases, as a question */
  question: string;
  onAsk: () => void;
  onDelete: () => void;
  onKeep: () => void;
  /** a request on this row is in flight: Delete waits */
  busy?: boolean;
  testIds: { ask: string; confirm: string };
}) {
  return confirming ? (
    <span role="group" aria-label="Confirm deletion" className="confirm">
      <span className="small">{question}</span>
      <button
        type="button"
        className="small danger"
        disabled={busy}
        onClick={onDelete}
        data-testid={testIds.confirm}
      >
        Delete
      </button>
      <button type="button" className="small" onClick={onKeep}>
        Keep
      </button>
    </span>
  ) : (
    <button type="button" className="small danger" onClick={onAsk} data-testid={testIds.ask}>
      Delete…
    </button>
  );
}
