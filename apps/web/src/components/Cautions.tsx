/** The cautions every page carries: short in the footer, fuller on the start page. */

export const CAUTION_LINES = [
  "Contend is a stylised model to aid thinking. It is not a forecast and not financial or legal advice.",
  "War-gaming a competitor is internal work. Never share spending plans, bids or budgets with actual competitors: coordinating them can breach competition (antitrust) law.",
  "Public procurement bids follow their own rules. Defer to counsel and local rules.",
] as const;

export function CautionPanel() {
  return (
    <aside className="caution" aria-labelledby="caution-title" data-testid="caution-panel">
      <strong id="caution-title">Before you use the numbers</strong>
      <CautionItems />
    </aside>
  );
}

/** The cautions closing a debrief or a comparison (printed with it). */
export function DebriefCautions() {
  return (
    <div className="caution" style={{ marginTop: "1rem" }}>
      <strong>Cautions</strong>
      <CautionItems />
    </div>
  );
}

function CautionItems() {
  return (
    <ul>
      {CAUTION_LINES.map((line) => (
        <li key={line}>{line}</li>
      ))}
    </ul>
  );
}

export function CautionFooter() {
  return (
    <footer className="site-footer" data-testid="caution-footer">
      <div className="inner">
        {CAUTION_LINES.map((line) => (
          <p key={line}>{line}</p>
        ))}
      </div>
    </footer>
  );
}
