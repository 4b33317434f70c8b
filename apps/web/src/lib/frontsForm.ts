/**
 * The fronts explorer's form: fronts (name, prize, form) and rivals (budget, sunk flag, and one
 * cost, value and weight per front), kept as typed text so what the user typed stays visible.
 * The solver's validateFrontsScenario is the one set of rules; this file only converts.
 */
import type { FrontsScenario, PolicyKind } from "@contend/solver";

export interface FrontRow {
  name: string;
  prize: string;
  kind: "ratio" | "logit" | "allpay";
  /** decisiveness r (ratio) or scale k (logit); unused for all-pay */
  param: string;
}

export interface FrontsRivalRow {
  name: string;
  /** money; blank = no budget */
  budget: string;
  sunk: boolean;
  /** one entry per front; value blank = the front's prize, weight blank = 1 */
  cost: string[];
  value: string[];
  weight: string[];
  /**
   * Who plays this rival in a live session (the session editor only; the explorer leaves it
   * out): absent = a person, else a computer policy that plays fronts (FRONTS_POLICIES).
   */
  policy?: PolicyKind;
}

export interface FrontsForm {
  title: string;
  currency: string;
  fronts: FrontRow[];
  rivals: FrontsRivalRow[];
}

export type PerFrontField = "cost" | "value" | "weight";

/** An invented starting point: three gym chains over three neighbourhoods. */
export function initialFrontsForm(): FrontsForm {
  return {
    title: "Three gym chains split one season's marketing budget over three neighbourhoods",
    currency: "EUR",
    fronts: [
      { name: "Centre", prize: "90000", kind: "ratio", param: "1" },
      { name: "Docklands", prize: "60000", kind: "ratio", param: "0.8" },
      { name: "Hillside", prize: "30000", kind: "ratio", param: "1" },
    ],
    rivals: [
      {
        name: "Ironwood Fitness",
        budget: "40000",
        sunk: false,
        cost: ["1", "1", "1.2"],
        value: ["", "", ""],
        weight: ["1.3", "1", "1"],
      },
      {
        name: "Pulse Studios",
        budget: "25000",
        sunk: true,
        cost: ["1", "1", "1"],
        value: ["", "", ""],
        weight: ["1", "1", "1"],
      },
      {
        name: "Summit Gyms",
        budget: "10000",
        sunk: false,
        cost: ["1.4", "1", "0.9"],
        value: ["", "", ""],
        weight: ["1", "1", "1.2"],
      },
    ],
  };
}

function num(text: string): number | string {
  const t = text.trim();
  if (t === "") return t;
  const x = Number(t.replace(/,/g, ""));
  return Number.isFinite(x) ? x : t; // invalid text goes through so the validator names it
}

/** The form as a raw fronts scenario for validateFrontsScenario. */
export function frontsFormToRaw(form: FrontsForm): Record<string, unknown> {
  return {
    title: form.title,
    ...(form.currency.trim() === "" ? {} : { currency: form.currency.trim() }),
    fronts: form.fronts.map((f) => ({
      name: f.name,
      prize: num(f.prize),
      csf:
        f.kind === "ratio"
          ? { kind: "ratio", decisiveness: num(f.param) }
          : f.kind === "logit"
            ? { kind: "logit", scale: num(f.param) }
            : { kind: "allpay" },
    })),
    rivals: form.rivals.map((r) => {
      const per = (cells: string[], blank: (k: number) => number) =>
        cells.map((c, k) => (c.trim() === "" ? blank(k) : num(c)));
      const value = r.value.some((c) => c.trim() !== "")
        ? per(r.value, (k) => Number(form.fronts[k]?.prize) || 0)
        : null;
      const weight = r.weight.some((c) => c.trim() !== "") ? per(r.weight, () => 1) : null;
      return {
        name: r.name,
        cost: per(r.cost, () => Number.NaN),
        ...(value ? { value } : {}),
        ...(weight ? { weight } : {}),
        ...(r.budget.trim() === "" ? {} : { budget: num(r.budget) }),
        ...(r.sunk ? { sunkBudget: true } : {}),
      };
    }),
  };
}

/** Adds a front at the end; every rival gets cost 1 and defaults there. */
export function addFront(form: FrontsForm): FrontsForm {
  const n = form.fronts.length + 1;
  let name = `Front ${n}`;
  for (let j = n; form.fronts.some((f) => f.name === name); j++) name = `Front ${j + 1}`;
  return {
    ...form,
    fronts: [...form.fronts, { name, prize: "10000", kind: "ratio", param: "1" }],
    rivals: form.rivals.map((r) => ({
      ...r,
      cost: [...r.cost, "1"],
      value: [...r.value, ""],
      weight: [...r.weight, ""],
    })),
  };
}

/** Removes front k from the fronts and from every rival's per-front entries. */
export function removeFront(form: FrontsForm, k: number): FrontsForm {
  const drop = <T>(xs: T[]) => xs.filter((_, j) => j !== k);
  return {
    ...form,
    fronts: drop(form.fronts),
    rivals: form.rivals.map((r) => ({
      ...r,
      cost: drop(r.cost),
      value: drop(r.value),
      weight: drop(r.weight),
    })),
  };
}

export function addRival(form: FrontsForm): FrontsForm {
  const K = form.fronts.length;
  let name = `Rival ${form.rivals.length + 1}`;
  for (let j = form.rivals.length + 1; form.rivals.some((r) => r.name === name); j++)
    name = `Rival ${j + 1}`;
  const blank = () => new Array<string>(K).fill("");
  return {
    ...form,
    rivals: [
      ...form.rivals,
      {
        name,
        budget: "",
        sunk: false,
        cost: new Array<string>(K).fill("1"),
        value: blank(),
        weight: blank(),
      },
    ],
  };
}

export function removeRival(form: FrontsForm, i: number): FrontsForm {
  return { ...form, rivals: form.rivals.filter((_, j) => j !== i) };
}

/** A validated scenario as form text (numbers written plainly). */
export function scenarioToFrontsForm(s: FrontsScenario): FrontsForm {
  const K = s.fronts.length;
  const cells = (x: number | number[] | null | undefined, blank: string) =>
    Array.from({ length: K }, (_, k) => {
      if (x === null || x === undefined) return blank;
      return String(Array.isArray(x) ? x[k] : x);
    });
  return {
    title: s.title,
    currency: s.currency ?? "",
    fronts: s.fronts.map((f) => ({
      name: f.name,
      prize: String(f.prize),
      kind: f.csf.kind,
      param: String(
        f.csf.kind === "logit" ? f.csf.scale : f.csf.kind === "ratio" ? f.csf.decisiveness : 1,
      ),
    })),
    rivals: s.rivals.map((r) => ({
      name: r.name,
      budget: r.budget === null || r.budget === undefined ? "" : String(r.budget),
      sunk: r.sunkBudget === true,
      cost: cells(r.cost, "1"),
      value: cells(r.value, ""),
      weight: cells(r.weight, ""),
    })),
  };
}

/** The current value of a sweep path (see the solver's frontsParamPaths), or null. */
export function frontsParamValue(s: FrontsScenario, path: string): number | null {
  const [head, a, b, c] = path.split(".");
  if (head === "fronts") {
    const f = s.fronts[Number(a)];
    if (!f) return null;
    if (b === "prize") return f.prize;
    if (b === "csf" && c === "decisiveness" && f.csf.kind === "ratio") return f.csf.decisiveness;
    if (b === "csf" && c === "scale" && f.csf.kind === "logit") return f.csf.scale;
    return null;
  }
  const r = s.rivals[Number(a)];
  if (!r) return null;
  if (b === "budget") return r.budget ?? null;
  if (b === "cost" || b === "value" || b === "weight") {
    const x = r[b];
    const k = Number(c);
    if (Array.isArray(x)) return x[k] ?? null;
    if (typeof x === "number") return x;
    return b === "value" ? (s.fronts[k]?.prize ?? null) : 1;
  }
  return null;
}
