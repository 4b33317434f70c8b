import Link from "next/link";
import { CautionPanel } from "../components/Cautions";
import { TemplatePicker } from "../components/TemplatePicker";

export default function StartPage() {
  return (
    <>
      <section className="card">
        <h1>Rehearse a contest before you spend on it</h1>
        <p>
          Contend runs live war-gaming workshops for contests: situations where rivals spend money
          they do not get back (advertising, bid preparation, lobbying, sales pushes) to win one
          prize. Colleagues each play a rival, seal their spend round by round, and after every
          reveal see their payoff, the best reply they could have made and how far the room was from
          the Nash equilibrium. The explorer computes equilibria, best responses and comparative
          statics in your browser.
        </p>
        <div className="row">
          <Link className="button primary" href="/new">
            Build your own scenario
          </Link>
          <Link className="button" href="/join">
            Join with a code
          </Link>
          <Link className="button" href="/explore">
            Open the explorer
          </Link>
          <Link className="button" href="/replays">
            Past sessions
          </Link>
        </div>
      </section>
      <CautionPanel />
      <h2>Start from an invented scenario</h2>
      <TemplatePicker />
    </>
  );
}
