/**
 * The scenario editor's form model: text fields as typed, converted to the session scenario the
 * server and the CLI read. Every rule comes from the solver's validateScenario and the protocol's
 * schemas; this module only collects all of their messages instead of the first one, so each
 * field can show its own.
 */
import { plainError } from "./plainErrors";
import { POLICY_LABELS, validateScenario } from "@contend/solver";
import type { CsfSpec, PolicyKind, Provenance, RivalSpec, Scenario } from "@contend/solver";
import { sessionScenarioSchema, sessionSettingsSchema, spendStepOf } from "@contend/protocol";
import type { HiddenSettings } from "@contend/protocol";
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
  /** private costs and values (docs/protocol.md R40), kept unchanged from a loaded file */
  hidden: HiddenSettings | null;
}

/** value + onChange of one form field, for spreading into a field component. */
export function bindField<K extends keyof EditorForm>(
  form: EditorForm,
  setForm: (update: (f: EditorForm) => EditorForm) => void,
  key: K,
): { value: EditorForm[K]; onChange: (v: EditorForm[K]) => void } {
  return { value: form[key], onChange: (v) => setForm((f) => ({ ...f, [key]: v })) };
}

/** Field path (as the validators report it, e.g. "rivals.2.cost") -> message. */
export type FieldErrors = Record<string, string>;

export type FormResult =
  | { ok: true; scenario: SessionScenarioInput; errors: FieldErrors }
  | { ok: false; errors: FieldErrors; contest: Scenario | null };

let keyCounter = 0;
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
    hidden: null,
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

function numberText(x: number | null | undefined): string {
  return x === null || x === undefined ? "" : String(x);
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
  const clock = parseNumberField(form.clockSeconds);
  return {
    outcome: form.outcome,
    spendStep: parseNumberField(form.spendStep),
    rounds: parseNumberField(form.rounds),
    clockSeconds: clock === undefined ? null : clock,
    missingMove: form.missingMove,
    computer,
    ...(form.hidden === null ? {} : { hidden: form.hidden }),
  };
}

/** A value that passes the validator at this path, used to look past one problem to the next. */
function placeholderFor(path: string): unknown {
  const last = path.split(".").pop() ?? "";
  if (last === "title") return "untitled";
  if (last === "name") return `placeholder-${path}`;
  if (last === "budget") return null;
  if (last === "currency" || last === "leader") return null;
  if (last === "csf" || last === "kind") return { kind: "ratio", decisiveness: 1 };
  return 1;
}

function setAtPath(root: Record<string, unknown>, path: string, value: unknown): boolean {
  const parts = path.split(".");
  let node: unknown = root;
  for (let i = 0; i < parts.length - 1; i++) {
    const part = parts[i] as string;
    if (typeof node !== "object" || node === null) return false;
    node = (node as Record<string, unknown>)[part];
  }
  if (typeof node !== "object" || node === null) return false;
  const lastKey = parts[parts.length - 1] as string;
  if (lastKey === "kind" && parts.length === 2) {
    root.csf = value;
    return true;
  }
  (node as Record<string, unknown>)[lastKey] = value;
  return true;
}

/**
 * Every contest problem, one per field: validate, note the first problem, patch that field with
 * a valid placeholder, repeat. The validator stays the only place the rules live.
 */
export function contestErrors(raw: Record<string, unknown>, limit = 64): FieldErrors {
  const errors: FieldErrors = {};
  const work = structuredClone(raw);
  for (let i = 0; i < limit; i++) {
    const r = validateScenario(work);
    if (r.ok) break;
    const path = r.path === "" ? "scenario" : r.path;
    if (errors[path] !== undefined) break;
    errors[path] = r.message;
    if (
      path === "scenario" ||
      path === "rivals" ||
      !setAtPath(work, r.path, placeholderFor(r.path))
    )
      break;
  }
  return errors;
}

function zodPath(path: readonly PropertyKey[]): string {
  return path.map((p) => String(p)).join(".");
}

/** Form -> session scenario, with every field problem mapped to its path. */
export function formToScenario(form: EditorForm): FormResult {
  const contestRaw = formToContestRaw(form);
  const sessionRaw = formToSessionRaw(form);
  const errors = contestErrors(contestRaw);

  const settings = sessionSettingsSchema.safeParse(sessionRaw);
  if (!settings.success) {
    for (const issue of settings.error.issues) {
      const path = `session.${zodPath(issue.path)}`;
      errors[path] ??= issue.message;
    }
  }
  const contest = validateScenario(contestRaw);
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
  if (field === "policy" || field === "policyArg") {
    const name = form.rivals[index]?.name.trim() ?? "";
    const prefix = `session.computer.${name}`;
    const hit = Object.keys(errors).find((k) => k === prefix || k.startsWith(`${prefix}.`));
    return hit === undefined ? undefined : errors[hit];
  }
  return errors[`rivals.${index}.${field}`];
}

/**
 * A session scenario (template, import, CLI file) -> form text. Policy settings without a field
 * are kept on the row (policyKept); other unknown extras are dropped.
 */
export function scenarioToForm(s: SessionScenarioInput): EditorForm {
  const session = s.session ?? {};
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
    hidden: (session.hidden as HiddenSettings | undefined) ?? null,
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
