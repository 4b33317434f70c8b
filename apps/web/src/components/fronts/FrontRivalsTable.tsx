"use client";

import { useState } from "react";
import type { FrontsForm, FrontsRivalRow, PerFrontField } from "../../lib/frontsForm";
import { addRival, removeRival } from "../../lib/frontsForm";
import { SelectField } from "../Field";
import { CellField, EditableRows } from "./EditableRows";

type Setter = (update: (f: FrontsForm) => FrontsForm) => void;

const FIELDS = [
  { value: "cost", label: "Cost of one unit of effort" },
  { value: "value", label: "Value of the front (blank: its prize)" },
  { value: "weight", label: "Head start w (blank: 1)" },
] as const;

/** Rivals: budget (money over all fronts), sunk flag, and one figure per front for the chosen field. */
export function FrontRivalsTable({ form, setForm }: { form: FrontsForm; setForm: Setter }) {
  const [field, setField] = useState<PerFrontField>("cost");
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
        `Budget${cur ? ` (${cur})` : ""}`,
        "Sunk",
        ...form.fronts.map((f, k) => f.name || `Front ${k + 1}`),
      ]}
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
            testId={`frival-${i}-name`}
          />
          <CellField
            numeric
            label={`Rival ${i + 1} budget`}
            value={r.budget}
            placeholder="no cap"
            onChange={(v) => patch(i, { budget: v })}
            testId={`frival-${i}-budget`}
          />
          <td>
            <input
              type="checkbox"
              checked={r.sunk}
              aria-label={`Rival ${i + 1} budget is sunk`}
              onChange={(e) => patch(i, { sunk: e.target.checked })}
              data-testid={`frival-${i}-sunk`}
            />
          </td>
          {form.fronts.map((f, k) => (
            <CellField
              key={k}
              numeric
              label={`Rival ${i + 1} ${field} on ${f.name || `front ${k + 1}`}`}
              value={r[field][k] ?? ""}
              placeholder={field === "cost" ? "" : "default"}
              onChange={(v) => setCell(i, k, v)}
              testId={`frival-${i}-${field}-${k}`}
            />
          ))}
        </>
      )}
    />
  );
}
