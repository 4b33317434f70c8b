/**
 * The scenario editor's form model: text fields as typed, converted to the session scenario the
 * server and the CLI read. Every rule comes from the solver's validateScenario and the protocol's
 * schemas; formErrors and privateForm collect all of their messages instead of the first one, so
 * each field can show its own. Files into the form: editorImport.
 */
import { POLICY_LABELS, validateScenario } from "@contend/solver";
import type { CsfSpec, PolicyKind, Provenance, Scenario } from "@contend/solver";
import { sessionScenarioSchema, sessionSettingsSchema } from "@contend/protocol";
import { contestErrors, zodPath } from "./formErrors";
import type { FieldErrors } from "./formErrors";
import { hiddenRaw, privateErrors } from "./privateForm";
import type { PrivateRanges, TruthChoice } from "./privateForm";
import type { SessionScenarioInput } from "./sessionTypes";

export type PolicyChoice = "human" | PolicyKind;

/** "Person" plus every computer policy the solver offers, with the solver's own labels. */
export const POLICY_CHOICES: readonly { value: PolicyChoice; label: string }[] = [
  { value: "human", label: "Person" },
  ...(Object.keys(POLICY_LABELS) as PolicyKind[]).map((kind) => ({
    value: kind,
    label: `Computer: ${POLICY_LABELS[kind].label.toLowerCase()}`,
  })),
];

/** Policies with one number to set, and what it is called. */
export const POLICY_ARGUMENT: Partial<
  Record<PolicyKind, { field: string; label: string; placeholder: string }>
> = {
  overspender: {
    field: "factor",
    label: "multiple of equilibrium",
    placeholder: "factor (default)",
  },
  fixed: { field: "spend", label: "fixed spend (money)", placeholder: "spend" },
};

export interface RivalRow {
  /** stable React key; not part of the scenario */
  key: string;
  name: string;
  cost: string;
  value: string;
  weight: string;
  budget: string;
  decisiveness: string;
  policy: PolicyChoice;
  /** the policy's one number (overspender factor, fixed effort); blank = its default */
  policyArg: string;
  /**
   * Settings of an imported policy that the form has no field for (the overspender's noise and
   * decay), kept so an import and export loses nothing; they apply while the same kind is chosen.
   */
  policyKept: { kind: PolicyKind; fields: Record<string, unknown> } | null;
}

export interface EditorForm {
  title: string;
  prize: string;
  currency: string;
  csfKind: CsfSpec["kind"];
  decisiveness: string;
  scale: string;
  rivals: RivalRow[];
  outcome: "shares" | "winner";
  spendStep: string;
  rounds: string;
  clockSeconds: string;
  missingMove: "zero" | "repeat";
  /** where the numbers came from (a calibration), kept unchanged into the session */
  provenance: Provenance | null;
  /** private costs and values (docs/protocol.md R40): the ranges the other seats see, by row */
  privateRanges: PrivateRanges;
  /** with private numbers: drawn from the ranges at the start, or the numbers in the table */
  truth: TruthChoice;
}

/** value + onChange of one form field, for spreading into a field component. */
export function bindField<K extends keyof EditorForm>(
  form: EditorForm,
  setForm: (update: (f: EditorForm) => EditorForm) => void,
  key: K,
): { value: EditorForm[K]; onChange: (v: EditorForm[K]) => void } {
  return { value: form[key], onChange: (v) => setForm((f) => ({ ...f, [key]: v })) };
}

export type { FieldErrors };

export type FormResult =
  | { ok: true; scenario: SessionScenarioInput; errors: FieldErrors }
  | { ok: false; errors: FieldErrors; contest: Scenario | null };

let keyCounter = 0;
/** A stable React key for a rival row (also the key of its private ranges). */
export function newRowKey(): string {
  keyCounter += 1;
  return `row-${keyCounter}`;
}

export function blankRival(index: number): RivalRow {
  return {
    key: newRowKey(),
    name: `Rival ${index + 1}`,
    cost: "1",
    value: "",
    weight: "",
    budget: "",
    decisiveness: "",
    policy: "human",
    policyArg: "",
    policyKept: null,
  };
}

export function defaultForm(): EditorForm {
  return {
    title: "My contest",
    prize: "100",
    currency: "$",
    csfKind: "ratio",
    decisiveness: "1",
    scale: "0.1",
    rivals: [blankRival(0), blankRival(1)],
    outcome: "shares",
    spendStep: "1",
    rounds: "5",
    clockSeconds: "",
    missingMove: "zero",
    provenance: null,
    privateRanges: {},
    truth: "draw",
  };
}

/**
 * Text -> number for the validators. Blank gives undefined (the field's default); text that is
 * not a number is passed on as text so the validator reports it at the right path.
 */
export function parseNumberField(text: string): number | string | undefined {
  const t = text.trim().replace(/,/g, "");
  if (t === "") return undefined;
  const n = Number(t);
  return Number.isFinite(n) ? n : text;
}

function csfOf(form: EditorForm): Record<string, unknown> {
  if (form.csfKind === "ratio")
    return { kind: "ratio", decisiveness: parseNumberField(form.decisiveness) };
  if (form.csfKind === "logit") return { kind: "logit", scale: parseNumberField(form.scale) };
  return { kind: "allpay" };
}

function rivalOf(row: RivalRow): Record<string, unknown> {
  const out: Record<string, unknown> = { name: row.name.trim(), cost: parseNumberField(row.cost) };
  for (const key of ["value", "weight", "budget", "decisiveness"] as const) {
    const v = parseNumberField(row[key]);
    if (v !== undefined) out[key] = v;
  }
  return out;
}

function policyOf(row: RivalRow): Record<string, unknown> | null {
  if (row.policy === "human") return null;
  const kept = row.policyKept?.kind === row.policy ? row.policyKept.fields : {};
  const policy: Record<string, unknown> = { kind: row.policy, ...kept };
  const arg = POLICY_ARGUMENT[row.policy];
  const v = arg === undefined ? undefined : parseNumberField(row.policyArg);
  if (arg !== undefined && v !== undefined) policy[arg.field] = v;
  // a typed spend replaces the older effort form of an imported fixed policy
  if (row.policy === "fixed" && v !== undefined) delete policy.effort;
  return policy;
}

/** The kept settings of a row's chosen policy, for showing beside its select. */
export function keptPolicyFields(row: RivalRow): [string, unknown][] {
  return row.policyKept?.kind === row.policy ? Object.entries(row.policyKept.fields) : [];
}

/** The raw (unvalidated) contest object the form describes. */
export function formToContestRaw(form: EditorForm): Record<string, unknown> {
  const currency = form.currency.trim();
  return {
    title: form.title.trim(),
    prize: parseNumberField(form.prize),
    currency: currency === "" ? null : currency,
    csf: csfOf(form),
    rivals: form.rivals.map(rivalOf),
    leader: null,
    ...(form.provenance === null ? {} : { provenance: form.provenance }),
  };
}

/** The raw `session` object; computer seats are keyed by rival name. */
export function formToSessionRaw(form: EditorForm): Record<string, unknown> {
  const computer: Record<string, unknown> = {};
  for (const row of form.rivals) {
    const p = policyOf(row);
    if (p !== null) computer[row.name.trim()] = p;
  }
  const hidden = hiddenRaw(form.rivals, form.privateRanges, form.truth);
  return {
    outcome: form.outcome,
    spendStep: parseNumberField(form.spendStep),
    ...roundSettingsRaw(form),
    computer,
    ...(hidden === null ? {} : { hidden }),
  };
}

/** Rounds, clock and missing moves: the settings every live session takes, fronts too. */
export function roundSettingsRaw(form: EditorForm): Record<string, unknown> {
  const clock = parseNumberField(form.clockSeconds);
  return {
    rounds: parseNumberField(form.rounds),
    clockSeconds: clock === undefined ? null : clock,
    missingMove: form.missingMove,
  };
}

/** Session settings through the protocol's schema: every problem under `session.`. */
export function settingsErrors(sessionRaw: Record<string, unknown>): FieldErrors {
  const errors: FieldErrors = {};
  const settings = sessionSettingsSchema.safeParse(sessionRaw);
  if (!settings.success) {
    for (const issue of settings.error.issues)
      errors[`session.${zodPath(issue.path)}`] ??= issue.message;
  }
  return errors;
}

/** The problem of the computer seat of the rival with this name, if any. */
export function computerError(errors: FieldErrors, name: string): string | undefined {
  const prefix = `session.computer.${name.trim()}`;
  const hit = Object.keys(errors).find((k) => k === prefix || k.startsWith(`${prefix}.`));
  return hit === undefined ? undefined : errors[hit];
}

/** Form -> session scenario, with every field problem mapped to its path. */
export function formToScenario(form: EditorForm): FormResult {
  const contestRaw = formToContestRaw(form);
  const sessionRaw = formToSessionRaw(form);
  const errors = { ...contestErrors(contestRaw), ...settingsErrors(sessionRaw) };
  const contest = validateScenario(contestRaw);
  const names = form.rivals.map((r) => r.name.trim());
  const hidden = (sessionRaw.hidden as Record<string, unknown> | undefined) ?? null;
  for (const [path, message] of Object.entries(
    privateErrors(hidden, names, contest.ok ? contest.value : null),
  ))
    errors[path] ??= message;
  if (Object.keys(errors).length > 0) {
    return { ok: false, errors, contest: contest.ok ? contest.value : null };
  }
  // Cross-field rules of a live session (seat count, computer names).
  const whole = sessionScenarioSchema.safeParse({ ...contestRaw, session: sessionRaw });
  if (!whole.success) {
    for (const issue of whole.error.issues)
      errors[zodPath(issue.path) || "scenario"] ??= issue.message;
    return { ok: false, errors, contest: contest.ok ? contest.value : null };
  }
  const scenario = {
    ...(contest.ok ? contest.value : {}),
    session: sessionRaw,
  } as SessionScenarioInput;
  return { ok: true, scenario, errors: {} };
}

/** The error for one rival field, also catching computer-policy problems keyed by name. */
export function rivalFieldError(
  errors: FieldErrors,
  form: EditorForm,
  index: number,
  field: keyof Omit<RivalRow, "key">,
): string | undefined {
  if (field === "policy" || field === "policyArg")
    return computerError(errors, form.rivals[index]?.name ?? "");
  return errors[`rivals.${index}.${field}`];
}
