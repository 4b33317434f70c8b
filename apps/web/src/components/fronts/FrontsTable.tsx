"use client";

import type { FieldErrors } from "../../lib/formErrors";
import type { FrontRow, FrontsForm } from "../../lib/frontsForm";
import { addFront, removeFront } from "../../lib/frontsForm";
import { SelectField } from "../Field";
import { CellField, EditableRows } from "./EditableRows";

type Setter = (update: (f: FrontsForm) => FrontsForm) => void;

const KINDS = [
  { value: "ratio", label: "Ratio (Tullock)" },
  { value: "logit", label: "Logit (difference)" },
  { value: "allpay", label: "All-pay (highest wins)" },
] as const;

/**
 * The fronts: name, prize (money), contest form and its parameter; add and remove. With
 * `errors` (field path -> message, the session editor) each cell shows its own problem.
 */
export function FrontsTable({
  form,
  setForm,
  errors = {},
}: {
  form: FrontsForm;
  setForm: Setter;
  errors?: FieldErrors;
}) {
  const patch = (k: number, p: Partial<FrontRow>) =>
    setForm((f) => ({ ...f, fronts: f.fronts.map((x, j) => (j === k ? { ...x, ...p } : x)) }));
  const cur = form.currency.trim();
  return (
    <EditableRows
      legend="Fronts"
      intro={
        <p className="small muted">
          Each front is its own contest (a district, an account, a tender) with its own prize and
          form; the rivals fight all of them at once. Ratio: p = w·e^r / Σ w·e^r (Tullock 1980);
          logit: p = w·exp(k·e) / Σ w·exp(k·e) (Hirshleifer 1989); all-pay: the highest effort wins
          the whole prize and everyone pays what it spent (usually no pure equilibrium).
        </p>
      }
      headers={["Front", `Prize (${cur || "money"})`, "Form", "r or k"]}
      items={form.fronts}
      name={(fr, k) => `front ${fr.name || k + 1}`}
      onRemove={(k) => setForm((f) => removeFront(f, k))}
      onAdd={() => setForm(addFront)}
      addLabel="Add front"
      testId="fronts-table"
      idPrefix="front"
      cells={(fr, k) => (
        <>
          <CellField
            label={`Front ${k + 1} name`}
            value={fr.name}
            onChange={(v) => patch(k, { name: v })}
            error={errors[`fronts.${k}.name`]}
            testId={`front-${k}-name`}
          />
          <CellField
            numeric
            label={`Front ${k + 1} prize`}
            value={fr.prize}
            onChange={(v) => patch(k, { prize: v })}
            error={errors[`fronts.${k}.prize`]}
            testId={`front-${k}-prize`}
          />
          <td>
            <SelectField
              compact
              label={`Front ${k + 1} form`}
              value={fr.kind}
              options={KINDS}
              onChange={(v) => patch(k, { kind: v })}
              error={errors[`fronts.${k}.csf.kind`]}
              testId={`front-${k}-kind`}
            />
          </td>
          <CellField
            numeric
            disabled={fr.kind === "allpay"}
            label={`Front ${k + 1} ${fr.kind === "ratio" ? "decisiveness r" : fr.kind === "logit" ? "logit scale k" : "parameter (none for all-pay)"}`}
            value={fr.kind === "allpay" ? "" : fr.param}
            {...(fr.kind === "allpay" ? { placeholder: "none" } : {})}
            onChange={(v) => patch(k, { param: v })}
            error={errors[`fronts.${k}.csf.${fr.kind === "logit" ? "scale" : "decisiveness"}`]}
            testId={`front-${k}-param`}
          />
        </>
      )}
    />
  );
}
