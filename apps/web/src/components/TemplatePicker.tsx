"use client";

import Link from "next/link";
import { useCreateSession } from "../hooks/useCreateSession";
import { encodeState } from "../lib/urlState";
import { TEMPLATES } from "../lib/templates";
import { FRONTS_TEMPLATES } from "../lib/frontsTemplates";
import { MadeSession } from "./CreatedSession";
import { CreateSessionButton } from "./CreateSessionButton";

export function TemplatePicker() {
  const { create, pending, busy, created, error } = useCreateSession();

  function start(id: string) {
    const t = TEMPLATES.find((x) => x.id === id) ?? FRONTS_TEMPLATES.find((x) => x.id === id);
    if (t) void create(t.scenario, id);
  }

  const startProps = (id: string) => ({
    pending: pending === id,
    created: created?.from === id,
    disabled: busy,
    onClick: () => start(id),
  });

  return (
    <>
      <div className="grid-3">
        {TEMPLATES.map((t) => (
          <TemplateCard
            key={t.id}
            template={t}
            facts={`${t.scenario.rivals.length} rivals · ${t.scenario.session?.rounds ?? 5} rounds · ${
              t.scenario.session?.outcome === "winner" ? "one winner drawn" : "prize shared"
            }`}
            explore={{
              href: `/explore?s=${encodeState({ sc: stripSession(t.scenario) })}`,
              label: "Explore",
            }}
            start={startProps(t.id)}
          />
        ))}
        {FRONTS_TEMPLATES.map((t) => (
          <TemplateCard
            key={t.id}
            template={t}
            facts={`${t.scenario.rivals.length} rivals · ${t.scenario.fronts.length} fronts, one budget each · ${t.scenario.session?.rounds ?? 5} rounds`}
            explore={{ href: "/explore/fronts", label: "Explore fronts" }}
            start={startProps(t.id)}
          />
        ))}
      </div>
      <div aria-live="polite">
        {error && <p className="notice error">{error}</p>}
        <MadeSession created={created} />
      </div>
    </>
  );
}

/** One template: what it is, its size, and Start session, Edit first and Explore. */
function TemplateCard({
  template,
  facts,
  explore,
  start,
}: {
  template: { id: string; label: string; blurb: string };
  /** rivals, rounds and the like, in one line */
  facts: string;
  explore: { href: string; label: string };
  start: { pending: boolean; created: boolean; disabled: boolean; onClick: () => void };
}) {
  const t = template;
  return (
    <article className="card" data-testid={`template-${t.id}`}>
      <h3>{t.label}</h3>
      <p className="small">{t.blurb}</p>
      <p className="small muted">{facts}</p>
      <div className="row">
        <CreateSessionButton label="Start session" {...start} testId={`start-template-${t.id}`} />
        <Link className="button" href={`/new?template=${t.id}`}>
          Edit first
        </Link>
        <Link className="button" href={explore.href}>
          {explore.label}
        </Link>
      </div>
    </article>
  );
}

function stripSession<T extends { session?: unknown }>(s: T): Omit<T, "session"> {
  const { session: _session, ...rest } = s;
  return rest;
}
