/**
 * The facilitator's shock builder: one draft change at a time, turned into a protocol Shock.
 * Range rules stay in the engine (it re-validates the whole scenario); here only the text is
 * read as numbers.
 */
import type { PolicySpec } from "@contend/solver";
import type { Shock } from "@contend/protocol";
import { RIVAL_SHOCK_FIELDS } from "@contend/protocol";
import type { RivalShockField } from "@contend/protocol";
import { parseNumberField } from "./editorForm";

export type ShockTarget = Shock["target"];

export interface ShockDraft {
  target: ShockTarget;
  index: string;
  field: RivalShockField;
  value: string;
  csfKind: "ratio" | "logit" | "allpay";
  csfParam: string;
  name: string;
  cost: string;
  policy: "human" | PolicySpec["kind"];
}

export const SHOCK_TARGETS: readonly { value: ShockTarget; label: string }[] = [
  { value: "rival", label: "Change a rival" },
  { value: "prize", label: "Change the prize" },
  { value: "csf", label: "Change the contest form" },
  { value: "add-rival", label: "Add a rival" },
  { value: "retire-rival", label: "Retire a rival" },
];

export const SHOCK_FIELDS = RIVAL_SHOCK_FIELDS;

export function blankDraft(): ShockDraft {
  return {
    target: "rival",
    index: "0",
    field: "cost",
    value: "",
    csfKind: "ratio",
    csfParam: "1",
    name: "",
    cost: "1",
    policy: "human",
  };
}

function num(
  text: string,
  what: string,
): { ok: true; value: number } | { ok: false; message: string } {
  const v = parseNumberField(text);
  if (typeof v !== "number") return { ok: false, message: `${what} must be a number` };
  return { ok: true, value: v };
}

/** Draft -> Shock, or a message naming the field to fix. */
export function draftToShock(
  d: ShockDraft,
): { ok: true; shock: Shock } | { ok: false; message: string } {
  switch (d.target) {
    case "rival": {
      const index = Number(d.index);
      if (d.value.trim() === "") {
        if (d.field === "cost") return { ok: false, message: "cost needs a value" };
        return { ok: true, shock: { target: "rival", index, field: d.field, value: null } };
      }
      const v = num(d.value, d.field);
      return v.ok
        ? { ok: true, shock: { target: "rival", index, field: d.field, value: v.value } }
        : v;
    }
    case "prize": {
      const v = num(d.value, "prize");
      return v.ok ? { ok: true, shock: { target: "prize", value: v.value } } : v;
    }
    case "csf": {
      if (d.csfKind === "allpay")
        return { ok: true, shock: { target: "csf", csf: { kind: "allpay" } } };
      const v = num(d.csfParam, d.csfKind === "ratio" ? "decisiveness" : "scale");
      if (!v.ok) return v;
      return {
        ok: true,
        shock: {
          target: "csf",
          csf:
            d.csfKind === "ratio"
              ? { kind: "ratio", decisiveness: v.value }
              : { kind: "logit", scale: v.value },
        },
      };
    }
    case "add-rival": {
      if (d.name.trim() === "") return { ok: false, message: "the new rival needs a name" };
      const c = num(d.cost, "cost");
      if (!c.ok) return c;
      const policy = d.policy === "human" ? null : ({ kind: d.policy } as PolicySpec);
      return {
        ok: true,
        shock: { target: "add-rival", rival: { name: d.name.trim(), cost: c.value }, policy },
      };
    }
    case "retire-rival":
      return { ok: true, shock: { target: "retire-rival", index: Number(d.index) } };
  }
}

/** A line of plain text for a pending or applied change. */
export function describeShock(s: Shock, names: readonly string[]): string {
  switch (s.target) {
    case "rival":
      return `${names[s.index] ?? `Seat ${s.index + 1}`}: ${s.field} → ${s.value === null ? "default" : s.value}`;
    case "prize":
      return `Prize → ${s.value}`;
    case "csf":
      return s.csf.kind === "ratio"
        ? `Contest form → ratio, r = ${s.csf.decisiveness}`
        : s.csf.kind === "logit"
          ? `Contest form → logit, k = ${s.csf.scale}`
          : "Contest form → all-pay";
    case "add-rival":
      return `Add ${s.rival.name} (cost ${s.rival.cost})${s.policy ? `, computer: ${s.policy.kind}` : ""}`;
    case "retire-rival":
      return `Retire ${names[s.index] ?? `Seat ${s.index + 1}`}`;
  }
}
