import { GlossaryList } from "./Glossary";

/**
 * Methods and sources, out of the way of the screens that use them: a closed section at the
 * end of the editor, the explorer and the debrief. The screens themselves speak plain words.
 */
export function AboutTheMaths({ method }: { method?: string | null }) {
  return (
    <details className="about-maths" data-testid="about-maths">
      <summary>About the maths</summary>
      <h3>Words used here</h3>
      <GlossaryList />
      <h3>How the winner is decided (contest forms)</h3>
      <ul className="small">
        <li>
          Ratio: rival i wins with probability w·e<sub>i</sub>
          <sup>r</sup> / Σ w·e<sup>r</sup>, where e is effort, w the head start and r the
          decisiveness (Tullock 1980). If nobody spends, the prize is split equally.
        </li>
        <li>
          Logit: probability w·exp(k·e<sub>i</sub>) / Σ w·exp(k·e) with scale k (Hirshleifer 1989).
        </li>
        <li>All-pay: the highest effort wins, ties split; everyone pays what they bid.</li>
        <li>Effort is money spent divided by the rival&apos;s cost per unit of effort.</li>
      </ul>
      <h3>How the equilibrium is found</h3>
      <ul className="small">
        <li>
          Ratio contests with decisiveness up to 1: closed forms where they apply (Hillman &amp;
          Riley 1989 for two rivals; the symmetric Tullock formula), otherwise the share-function
          method (Cornes &amp; Hartley 2005).
        </li>
        <li>
          Decisiveness above 1 and logit contests: a search over which rivals spend anything, with
          every candidate checked against each rival&apos;s best reply over its whole range.
        </li>
        <li>
          All-pay contests: mixed equilibria, where rivals randomise their bids (Hillman &amp; Riley
          1989; Baye, Kovenock &amp; de Vries 1996). Figures are then expected values.
        </li>
        <li>
          A leader who moves first: the leader&apos;s best commitment given everyone&apos;s reply
          (Dixit 1987).
        </li>
        <li>
          Every answer is checked: the largest regret of the equilibrium found (its &quot;Nash
          gap&quot;) is measured and shown.
        </li>
      </ul>
      <h3>Sensitivity (comparative statics)</h3>
      <ul className="small">
        <li>
          Rows marked &ldquo;analytic&rdquo; differentiate the two-rival closed form (Hillman &amp;
          Riley 1989); rows marked &ldquo;numeric&rdquo; are numerical derivatives of the solved
          equilibrium (central differences with Richardson extrapolation).
        </li>
      </ul>
      {method ? (
        <p className="small muted" data-testid="about-method">
          Method used for this result: {method}
        </p>
      ) : null}
    </details>
  );
}
