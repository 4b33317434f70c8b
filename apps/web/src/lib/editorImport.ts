/**
 * Scenario files into the editor's form: a template, an import, a CLI file or a scenario handed
 * over in the address. Every problem is reported at once, each naming its field.
 */
import { plainError } from "./plainErrors";
import { validateScenario } from "@contend/solver";
import type { PolicyKind, RivalSpec } from "@contend/solver";
import { sessionSettingsSchema, spendStepOf } from "@contend/protocol";
import type { HiddenSettings } from "@contend/protocol";
import { newRowKey, POLICY_ARGUMENT } from "./editorForm";
import type { EditorForm, RivalRow } from "./editorForm";
import { contestErrors, zodPath } from "./formErrors";
import { privateErrors, privateRangesOf } from "./privateForm";
import type { SessionScenarioInput } from "./sessionTypes";

function numberText(x: number | null | undefined): string {
  return x === null || x === undefined ? "" : String(x);
}

/**
 * A session scenario (template, import, CLI file) -> form text. Policy settings without a field
 * are kept on the row (policyKept); other unknown extras are dropped.
 */
export function scenarioToForm(s: SessionScenarioInput): EditorForm {
  const session = s.session ?? {};
  const hidden = session.hidden as HiddenSettings | undefined;
  const computer = (session.computer ?? {}) as Record<string, Record<string, unknown>>;
  const rivals: RivalRow[] = s.rivals.map((r: RivalSpec) => {
    const policy = Object.hasOwn(computer, r.name) ? computer[r.name] : undefined;
    const kind = (policy?.kind as PolicyKind | undefined) ?? null;
    const argField = kind === null ? undefined : POLICY_ARGUMENT[kind]?.field;
    const arg = argField === undefined ? undefined : policy?.[argField];
    const fields = Object.fromEntries(
      Object.entries(policy ?? {}).filter(([k]) => k !== "kind" && k !== argField),
    );
    return {
      key: newRowKey(),
      name: r.name,
      cost: numberText(r.cost),
      value: numberText(r.value),
      weight: numberText(r.weight),
      budget: numberText(r.budget),
      decisiveness: numberText(r.decisiveness),
      policy: kind ?? "human",
      policyArg: typeof arg === "number" ? String(arg) : "",
      policyKept: kind !== null && Object.keys(fields).length > 0 ? { kind, fields } : null,
    };
  });
  return {
    title: s.title,
    prize: numberText(s.prize),
    currency: s.currency ?? "",
    csfKind: s.csf.kind,
    decisiveness: s.csf.kind === "ratio" ? numberText(s.csf.decisiveness) : "1",
    scale: s.csf.kind === "logit" ? numberText(s.csf.scale) : "0.1",
    rivals,
    outcome: session.outcome ?? "shares",
    spendStep: numberText(spendStepOf(session)),
    rounds: numberText(session.rounds ?? 5),
    clockSeconds: numberText(session.clockSeconds ?? null),
    missingMove: session.missingMove ?? "zero",
    provenance: s.provenance ?? null,
    privateRanges: privateRangesOf(rivals, hidden),
    truth: hidden?.truth ?? "draw",
  };
}

/** Parses an imported JSON text (CLI scenario file, with or without `session`). */
export function parseScenarioText(
  text: string,
): { ok: true; form: EditorForm } | { ok: false; message: string; problems: string[] } {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (e) {
    const message = `This is not valid JSON (${(e as Error).message}).`;
    return { ok: false, message, problems: [message] };
  }
  return parseScenarioValue(raw);
}

/** A parsed scenario value (an import, or one handed over in the address) -> form. */
export function parseScenarioValue(
  raw: unknown,
): { ok: true; form: EditorForm } | { ok: false; message: string; problems: string[] } {
  if (typeof raw !== "object" || raw === null || Array.isArray(raw)) {
    const message = "The file must hold one JSON object, { ... }.";
    return { ok: false, message, problems: [message] };
  }
  const { session, ...contestPart } = raw as Record<string, unknown>;
  // Every problem at once: the contest's fields one by one, then the session settings.
  const errors = contestErrors(contestPart);
  const settings = sessionSettingsSchema.safeParse(session ?? {});
  if (!settings.success) {
    for (const issue of settings.error.issues) {
      errors[`session.${zodPath(issue.path)}`] ??= issue.message;
    }
  }
  const contest = validateScenario(contestPart);
  if (settings.success && settings.data.hidden && contest.ok) {
    const names = contest.value.rivals.map((r) => r.name);
    Object.assign(errors, privateErrors(settings.data.hidden, names, contest.value));
  }
  if (Object.keys(errors).length > 0 || !contest.ok || !settings.success) {
    const problems = Object.entries(errors).map(([path, message]) => plainError(path, message));
    if (problems.length === 0 && !contest.ok)
      problems.push(plainError(contest.path, contest.message));
    const n = problems.length;
    return {
      ok: false,
      message: `The scenario has ${n} problem${n === 1 ? "" : "s"}: ${problems.join(" ")}`,
      problems,
    };
  }
  return { ok: true, form: scenarioToForm({ ...contest.value, session: settings.data }) };
}
