"use client";

import { useId, useState } from "react";
import type { ReactNode } from "react";

/**
 * The terms of the trade in plain words. Every screen marks a term with <Term id="...">, which
 * shows the entry on hover, on keyboard focus and on tap (phones have no hover).
 */
export const GLOSSARY = {
  equilibrium: {
    term: "Equilibrium",
    text: "The spends at which no rival could do better by changing only its own spend, given what the others spend. The benchmark for everyone reasoning perfectly (a Nash equilibrium).",
  },
  "mixed-equilibrium": {
    term: "Mixed equilibrium",
    text: "An equilibrium in which a rival draws its spend at random from a set of amounts, so no one can predict it and exploit it. Its equilibrium spend is the expected (average) spend; a single round's spend is compared with the whole spread: the chance that the equilibrium would have spent less.",
  },
  "best-reply": {
    term: "Best reply",
    text: "The spend that would have paid a rival most, given what the others actually spent.",
  },
  regret: {
    term: "Regret",
    text: "How much more a rival would have earned with its best reply instead of what it spent. Zero: it could not have done better. The largest regret in a round shows how far the room was from equilibrium.",
  },
  dissipation: {
    term: "Share of the prize spent (dissipation)",
    text: "What all rivals spent together as a share of the prize. At 100% the whole value of the prize was burned in winning it.",
  },
  decisiveness: {
    term: "Decisiveness",
    text: "How strongly spending more raises the chance of winning. Low: luck matters a lot. High: the biggest spender almost surely wins.",
  },
  "head-start": {
    term: "Head start",
    text: "An edge a rival has before anyone spends (an incumbent's reputation, a known brand): each unit it spends counts this many times as much. 1 means no edge.",
  },
  effort: {
    term: "Effort",
    text: "The model's internal quantity: money spent divided by the rival's cost per unit. Rivals with a lower cost get more effort for the same money.",
  },
} as const;

export type TermId = keyof typeof GLOSSARY;

/** A term with its plain-words explanation on hover, focus or tap. */
export function Term({ id, children }: { id: TermId; children?: ReactNode }) {
  const entry = GLOSSARY[id];
  const tipId = useId();
  const [open, setOpen] = useState(false);
  return (
    <span className="term" data-open={open ? "true" : "false"} onMouseLeave={() => setOpen(false)}>
      {children ?? entry.term}
      <button
        type="button"
        className="term-help"
        aria-label={`What does “${entry.term}” mean?`}
        aria-expanded={open}
        aria-describedby={tipId}
        onClick={() => setOpen((o) => !o)}
        onBlur={() => setOpen(false)}
        data-testid={`term-${id}`}
      >
        <svg
          viewBox="0 0 16 16"
          width="0.85em"
          height="0.85em"
          aria-hidden="true"
          focusable="false"
        >
          <circle cx="8" cy="8" r="7" fill="none" stroke="currentColor" strokeWidth="1.5" />
          <path
            d="M6 6.2a2 2 0 1 1 2.6 1.9c-.4.2-.6.5-.6.9v.6"
            fill="none"
            stroke="currentColor"
            strokeWidth="1.5"
            strokeLinecap="round"
          />
          <circle cx="8" cy="11.8" r="0.9" fill="currentColor" />
        </svg>
      </button>
      <span role="tooltip" id={tipId} className="term-tip">
        <strong>{entry.term}:</strong> {entry.text}
      </span>
    </span>
  );
}

/** The whole glossary as a list (the explorer's and the debrief's "Words used here"). */
export function GlossaryList({ ids }: { ids?: readonly TermId[] }) {
  const shown = ids ?? (Object.keys(GLOSSARY) as TermId[]);
  return (
    <dl className="glossary" data-testid="glossary">
      {shown.map((id) => (
        <div key={id}>
          <dt>{GLOSSARY[id].term}</dt>
          <dd>{GLOSSARY[id].text}</dd>
        </div>
      ))}
    </dl>
  );
}
