"use client";

import Link from "next/link";
import { useCreateSession } from "../hooks/useCreateSession";
import { encodeState } from "../lib/urlState";
import { TEMPLATES } from "../lib/templates";
import { FRONTS_TEMPLATES } from "../lib/frontsTemplates";
import { CreatedSession } from "./CreatedSession";
import { CreateSessionButton } from "./CreateSessionButton";

export function TemplatePicker() {
  const { create, pending, busy, created, error } = useCreateSession();

  function start(id: string) {
    const t = TEMPLATES.find((x) => x.id === id) ?? FRONTS_TEMPLATES.find((x) => x.id === id);
    if (t) void create(t.scenario, id);
  }

  return (
    <>
      <div className="grid-3">
        {TEMPLATES.map((t) => (
          <article key={t.id} className="card" data-testid={`template-${t.id}`}>
            <h3>{t.label}</h3>
            <p className="small">{t.blurb}</p>
            <p className="small muted">
              {t.scenario.rivals.length} rivals · {t.scenario.session?.rounds ?? 5} rounds ·{" "}
              {t.scenario.session?.outcome === "winner" ? "one winner drawn" : "prize shared"}
            </p>
            <div className="row">
              <CreateSessionButton
                label="Start session"
                pending={pending === t.id}
                created={created?.from === t.id}
                disabled={busy}
                onClick={() => start(t.id)}
                testId={`start-template-${t.id}`}
              />
              <Link className="button" href={`/new?template=${t.id}`}>
                Edit first
              </Link>
              <Link
                className="button"
                href={`/explore?s=${encodeState({ sc: stripSession(t.scenario) })}`}
              >
                Explore
              </Link>
            </div>
          </article>
        ))}
        {FRONTS_TEMPLATES.map((t) => (
          <article key={t.id} className="card" data-testid={`template-${t.id}`}>
            <h3>{t.label}</h3>
            <p className="small">{t.blurb}</p>
            <p className="small muted">
              {t.scenario.rivals.length} rivals · {t.scenario.fronts.length} fronts, one budget each
              · {t.scenario.session?.rounds ?? 5} rounds
            </p>
            <div className="row">
              <CreateSessionButton
                label="Start session"
                pending={pending === t.id}
                created={created?.from === t.id}
                disabled={busy}
                onClick={() => start(t.id)}
                testId={`start-template-${t.id}`}
              />
              <Link className="button" href={`/new?template=${t.id}`}>
                Edit first
              </Link>
              <Link className="button" href="/explore/fronts">
                Explore fronts
              </Link>
            </div>
          </article>
        ))}
      </div>
      <div aria-live="polite">
        {error && <p className="notice error">{error}</p>}
        {created && (
          <CreatedSession
            key={created.res.id}
            created={created.res}
            title={created.title}
            computer={created.computer}
          />
        )}
      </div>
    </>
  );
}

function stripSession<T extends { session?: unknown }>(s: T): Omit<T, "session"> {
  const { session: _session, ...rest } = s;
  return rest;
}
