"use client";

import { useState } from "react";
import type { ReactNode } from "react";
import type { FieldErrors } from "../../lib/formErrors";
import type { FrontsForm, FrontsRivalRow, PerFrontField } from "../../lib/frontsForm";
import { addRival, removeRival } from "../../lib/frontsForm";
import { SelectField } from "../Field";
import { CellField, EditableRows } from "./EditableRows";

type Setter = (update: (f: FrontsForm) => FrontsForm) => void;

const FIELDS = [
  { value: "cost", label: "Cost: money per unit of effort" },
  { value: "value", label: "Value of the front, money (blank: its prize)" },
  { value: "weight", label: "Head start w (blank: 1)" },
] as const;

/**
 * Rivals: budget (money over all fronts), sunk flag, and one figure per front for the chosen
 * field. The session editor adds `errors` (each cell shows its own; problems of the figures not
 * on show are listed under the table) and an `extra` column (who plays the rival).
 */
export function FrontRivalsTable({
  form,
  setForm,
  errors = {},
  extra,
}: {
  form: FrontsForm;
  setForm: Setter;
  errors?: FieldErrors;
  extra?: { header: string; cell: (r: FrontsRivalRow, i: number) => ReactNode };
}) {
  const [field, setField] = useState<PerFrontField>("cost");
  const elsewhere = Object.entries(errors).filter(([path]) => {
    const m = /^rivals\.\d+\.(cost|value|weight)\.\d+$/.exec(path);
    return m !== null && m[1] !== field;
  });
  const patch = (i: number, p: Partial<FrontsRivalRow>) =>
    setForm((f) => ({ ...f, rivals: f.rivals.map((r, j) => (j === i ? { ...r, ...p } : r)) }));
  const setCell = (i: number, k: number, v: string) =>
    setForm((f) => ({
      ...f,
      rivals: f.rivals.map((r, j) =>
        j === i ? { ...r, [field]: r[field].map((c, m) => (m === k ? v : c)) } : r,
      ),
    }));
  const cur = form.currency.trim();
  return (
    <EditableRows
      legend="Rivals and their budgets"
      intro={
        <>
          <p className="small muted">
            A budget is money over all fronts together (cost x effort summed); blank for no cap.
            Mark a budget sunk when the money is committed either way: the rival then only cares
            about what it wins. Pick which per-front figure the grid shows.
          </p>
          <div style={{ maxWidth: "22rem" }}>
            <SelectField
              label="Per-front figures"
              value={field}
              options={FIELDS}
              onChange={setField}
              testId="fronts-field"
            />
          </div>
        </>
      }
      headers={[
        "Rival",
        `Budget (${cur || "money"})`,
        "Sunk",
        ...form.fronts.map((f, k) => f.name || `Front ${k + 1}`),
        ...(extra ? [extra.header] : []),
      ]}
      after={
        elsewhere.length > 0 && (
          <ul className="field-error" data-testid="fronts-rivals-elsewhere">
            {elsewhere.map(([path, message]) => (
              <li key={path}>
                {message} (pick “
                {FIELDS.find((f) => path.includes(`.${f.value}.`))?.label ?? "the figures"}” to edit
                it)
              </li>
            ))}
          </ul>
        )
      }
      items={form.rivals}
      name={(r, i) => `rival ${r.name || i + 1}`}
      onRemove={(i) => setForm((x) => removeRival(x, i))}
      onAdd={() => setForm(addRival)}
      addLabel="Add rival"
      testId="fronts-rivals-table"
      idPrefix="frival"
      cells={(r, i) => (
        <>
          <CellField
            label={`Rival ${i + 1} name`}
            value={r.name}
            onChange={(v) => patch(i, { name: v })}
            error={errors[`rivals.${i}.name`]}
            testId={`frival-${i}-name`}
          />
          <CellField
            numeric
            label={`Rival ${i + 1} budget`}
            value={r.budget}
            placeholder="no cap"
            onChange={(v) => patch(i, { budget: v })}
            error={errors[`rivals.${i}.budget`]}
            testId={`frival-${i}-budget`}
          />
          <td>
            <input
              type="checkbox"
              checked={r.sunk}
              aria-label={`Rival ${i + 1} budget is sunk`}
              onChange={(e) => patch(i, { sunk: e.target.checked })}
              aria-invalid={errors[`rivals.${i}.sunkBudget`] ? true : undefined}
              data-testid={`frival-${i}-sunk`}
            />
            {errors[`rivals.${i}.sunkBudget`] && (
              <span className="field-error" role="alert">
                {errors[`rivals.${i}.sunkBudget`]}
              </span>
            )}
          </td>
          {form.fronts.map((f, k) => (
            <CellField
              key={k}
              numeric
              label={`Rival ${i + 1} ${field} on ${f.name || `front ${k + 1}`}`}
              value={r[field][k] ?? ""}
              placeholder={field === "cost" ? "" : "default"}
              onChange={(v) => setCell(i, k, v)}
              error={errors[`rivals.${i}.${field}.${k}`]}
              testId={`frival-${i}-${field}-${k}`}
            />
          ))}
          {extra?.cell(r, i)}
        </>
      )}
    />
  );
}
