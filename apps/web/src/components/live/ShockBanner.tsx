import type { RoleView } from "@contend/protocol";
import { currentShocks, roundOfShock, shockLines, shockLineText } from "../../lib/shockText";

/**
 * Announces the shocks applied since the last reveal, to every role, until the round they
 * change is revealed: what changed, from what to what. The live region is always in the page so
 * screen readers announce a shock the moment it arrives.
 */
export function ShockBanner({ view, large }: { view: RoleView; large?: boolean }) {
  const cur = view.scenario.currency ?? null;
  const shocks = view.status === "ended" ? [] : currentShocks(view);
  const lines = shocks.flatMap((s) => shockLines(s, cur));
  const round = shocks.length > 0 ? roundOfShock(shocks[0]!) : null;
  return (
    <div role="status" aria-live="polite" aria-atomic="true" data-testid="shock-live">
      {lines.length > 0 && (
        <section
          className="notice warn"
          data-testid="shock-banner"
          style={large ? { fontSize: "1.4rem" } : undefined}
        >
          <strong>
            The contest changes from round {round}
            {view.status === "open" && view.round === round ? " (this round)" : ""}:
          </strong>
          <ul style={{ margin: "0.25rem 0 0", paddingLeft: "1.2rem" }}>
            {lines.map((l) => (
              <li key={shockLineText(l)} data-testid="shock-line">
                {shockLineText(l)}
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}

/** Every shock of the session so far, by the round it first applied to (for debriefs). */
export function ShockList({ view }: { view: RoleView }) {
  const cur = view.scenario.currency ?? null;
  if (view.shocks.length === 0) return null;
  return (
    <section aria-labelledby="shock-list-title" data-testid="shock-list">
      <h3 id="shock-list-title">Changes during the session</h3>
      <ul>
        {view.shocks.map((s, k) => (
          <li key={k}>
            Before round {roundOfShock(s)}:{" "}
            {shockLines(s, cur).map(shockLineText).join("; ") || "no change to the numbers"}
          </li>
        ))}
      </ul>
    </section>
  );
}
