/**
 * The session editor's "several fronts" mode: the fronts explorer's form (frontsForm.ts) plus
 * the editor's own title, currency and round settings, converted to the body of
 * POST /api/sessions for a session with fronts (docs/protocol.md R45-R50). The rules are the
 * solver's validateFrontsScenario and the protocol's session schemas; this file converts and
 * collects every problem under its field path.
 */
import { validateFrontsScenario } from "@contend/solver";
import type { PolicyKind } from "@contend/solver";
import { FRONTS_POLICIES, sessionScenarioSchema } from "@contend/protocol";
import type { EditorForm, PolicyChoice } from "./editorForm";
import { POLICY_CHOICES, roundSettingsRaw, settingsErrors } from "./editorForm";
import { collectErrors, zodPath } from "./formErrors";
import type { FieldErrors } from "./formErrors";
import type { FrontsForm } from "./frontsForm";
import { frontsFormToRaw, scenarioToFrontsForm } from "./frontsForm";
import type { FrontsSessionInput } from "./sessionTypes";

export type EditorMode = "single" | "fronts";

/** "Person" and the computer policies a session with fronts accepts (R49), with their labels. */
export const FRONTS_POLICY_CHOICES = POLICY_CHOICES.filter(
  (c) => c.value === "human" || FRONTS_POLICIES.includes(c.value),
);

export type FrontsFormResult =
  | { ok: true; scenario: FrontsSessionInput; errors: FieldErrors }
  | { ok: false; errors: FieldErrors };

/** The `session` object of a fronts session: shares only, no private numbers (R45). */
export function frontsSessionRaw(form: EditorForm, fronts: FrontsForm): Record<string, unknown> {
  const computer: Record<string, unknown> = {};
  for (const r of fronts.rivals) if (r.policy) computer[r.name.trim()] = { kind: r.policy };
  return { outcome: "shares", ...roundSettingsRaw(form), computer };
}

/** The fronts scenario the two forms describe (title and currency are the editor's). */
export function frontsEditorRaw(form: EditorForm, fronts: FrontsForm): Record<string, unknown> {
  return frontsFormToRaw({ ...fronts, title: form.title.trim(), currency: form.currency });
}

/** Editor + fronts form -> session body, with every field problem under its path. */
export function frontsToSession(form: EditorForm, fronts: FrontsForm): FrontsFormResult {
  const raw = frontsEditorRaw(form, fronts);
  const session = frontsSessionRaw(form, fronts);
  const errors = { ...collectErrors(raw, validateFrontsScenario), ...settingsErrors(session) };
  if (Object.keys(errors).length > 0) return { ok: false, errors };
  // The rules of a live session with fronts (seat and front counts, computer policies).
  const whole = sessionScenarioSchema.safeParse({ ...raw, session });
  if (!whole.success) {
    for (const issue of whole.error.issues)
      errors[zodPath(issue.path) || "scenario"] ??= issue.message;
    return { ok: false, errors };
  }
  const valid = validateFrontsScenario(raw);
  if (!valid.ok) throw new Error(`fronts scenario passed the session schema only: ${valid.path}`);
  return { ok: true, scenario: { ...valid.value, session }, errors: {} };
}

const isFrontsPolicy = (p: PolicyChoice): p is PolicyKind =>
  p !== "human" && FRONTS_POLICIES.includes(p);

/**
 * A first fronts form from the single contest being edited: two fronts with the contest's
 * prize and form, and its rivals with their costs, budgets and the computer seats fronts take.
 */
export function frontsFromSingle(form: EditorForm): FrontsForm {
  const param = form.csfKind === "logit" ? form.scale : form.decisiveness;
  const front = (name: string) => ({ name, prize: form.prize, kind: form.csfKind, param });
  return {
    title: form.title,
    currency: form.currency,
    fronts: [front("Front 1"), front("Front 2")],
    rivals: form.rivals.map((r) => ({
      name: r.name,
      budget: r.budget,
      sunk: false,
      cost: [r.cost, r.cost],
      value: ["", ""],
      weight: ["", ""],
      ...(isFrontsPolicy(r.policy) ? { policy: r.policy } : {}),
    })),
  };
}

/** A fronts session body (a template, a file) as the two forms; null when it is not one. */
export function frontsSessionToForms(
  body: unknown,
  base: EditorForm,
): { form: EditorForm; fronts: FrontsForm } | null {
  const parsed = sessionScenarioSchema.safeParse(body);
  if (!parsed.success || !("fronts" in parsed.data)) return null;
  const { session, ...scenario } = parsed.data;
  const fronts = scenarioToFrontsForm(scenario);
  fronts.rivals = fronts.rivals.map((r) => {
    const kind = session.computer[r.name]?.kind;
    return kind !== undefined && FRONTS_POLICIES.includes(kind) ? { ...r, policy: kind } : r;
  });
  const form: EditorForm = {
    ...base,
    title: scenario.title,
    currency: scenario.currency ?? "",
    rounds: String(session.rounds),
    clockSeconds: session.clockSeconds === null ? "" : String(session.clockSeconds),
    missingMove: session.missingMove,
  };
  return { form, fronts };
}
