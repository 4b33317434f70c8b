"use client";

import type { HiddenField } from "@contend/protocol";
import type { EditorForm, FieldErrors } from "../lib/editorForm";
import { parseNumberField } from "../lib/editorForm";
import {
  privateFieldError,
  privateKey,
  privateOn,
  privatePath,
  privatePoint,
} from "../lib/privateForm";
import { RangeToggle } from "./explorer/RangeToggle";
import { RadioGroup } from "./Field";

type Setter = (update: (f: EditorForm) => EditorForm) => void;

const TRUTH_OPTIONS = [
  { value: "draw", label: "Drawn from the ranges when the session starts" },
  { value: "scenario", label: "The numbers in the table" },
] as const;

const FIELD_WORD: Record<HiddenField, string> = { cost: "cost", value: "value" };

/** What a private field's range is counted in, with the currency. */
function unitOf(field: HiddenField, currency: string): string {
  const c = currency.trim() || "money";
  return field === "cost" ? `${c} per unit of effort` : c;
}

/**
 * The "private" switch under a rival's cost or value (docs/protocol.md R40): on, the other seats
 * see only the range typed here; the seat itself sees its own number.
 */
export function PrivateToggle({
  form,
  setForm,
  errors,
  index,
  field,
}: {
  form: EditorForm;
  setForm: Setter;
  errors: FieldErrors;
  index: number;
  field: HiddenField;
}) {
  const row = form.rivals[index];
  if (!row) return null;
  const key = privateKey(row.key, field);
  const prize = Number(parseNumberField(form.prize));
  const name = row.name.trim() || `Rival ${index + 1}`;
  return (
    <RangeToggle
      field={{
        path: `rivals.${index}.${field}`,
        label: `${FIELD_WORD[field]} of ${name}`,
        unit: field === "value" ? "money" : "plain",
        point: privatePoint(row[field], field, prize),
      }}
      value={form.privateRanges[key]}
      onChange={(r) => setForm((f) => ({ ...f, privateRanges: { ...f.privateRanges, [key]: r } }))}
      prize={prize}
      error={privateFieldError(errors, row.name, field)}
      word="private"
      unit={unitOf(field, form.currency)}
      ids={{ toggle: `private-${index}-${field}`, error: `private-${index}-${field}-error` }}
    />
  );
}

/**
 * The session's private numbers: which they are, how the truth is set, and a switch back to
 * every number public. The ranges themselves sit under the rivals' fields.
 */
export function PrivateSettings({
  form,
  setForm,
  errors,
}: {
  form: EditorForm;
  setForm: Setter;
  errors: FieldErrors;
}) {
  const on = privateOn(form.rivals, form.privateRanges);
  const wrongName = Object.keys(errors).find(
    (k) =>
      k.startsWith("session.hidden") &&
      !on.some((e) => k.startsWith(privatePath(e.row.name, e.field))),
  );
  return (
    <fieldset data-testid="editor-private">
      <legend>Private numbers</legend>
      {on.length === 0 ? (
        <p className="small muted">
          Every number is public: each seat sees every rival&apos;s cost and value. Tick
          &quot;private&quot; under a rival&apos;s cost or value to show the other seats only a
          range; that seat still sees its own number.
        </p>
      ) : (
        <>
          <p className="small" data-testid="editor-hidden">
            Private:{" "}
            {on
              .map((e) => `${e.row.name.trim() || `Rival ${e.index + 1}`} ${FIELD_WORD[e.field]}`)
              .join(", ")}
            . Each seat sees its own numbers and only the ranges of the others until the session
            ends; the facilitator sees the truth throughout.
          </p>
          <RadioGroup
            legend="The true numbers are"
            name="private-truth"
            options={TRUTH_OPTIONS}
            value={form.truth}
            onChange={(v) => setForm((f) => ({ ...f, truth: v }))}
            testId="field-private-truth"
          />
          <p className="small muted">
            {form.truth === "draw"
              ? "Each true number is drawn from its range with the session's own seed, so nobody, you included, picks it; you see it in the console once the session starts."
              : "Each true number is the one in the table and must lie inside its range."}
          </p>
          {wrongName && (
            <p className="field-error" role="alert">
              {errors[wrongName]}
            </p>
          )}
          <button
            type="button"
            onClick={() => setForm((f) => ({ ...f, privateRanges: {} }))}
            data-testid="private-clear"
          >
            Make every number public
          </button>
        </>
      )}
    </fieldset>
  );
}
