"use client";

import type { FrontRow, FrontsForm } from "../../lib/frontsForm";
import { addFront, removeFront } from "../../lib/frontsForm";
import { SelectField, TextField } from "../Field";

type Setter = (update: (f: FrontsForm) => FrontsForm) => void;

const KINDS = [
  { value: "ratio", label: "Ratio (Tullock)" },
  { value: "logit", label: "Logit (difference)" },
] as const;

/** The fronts: name, prize (money), contest form and its parameter; add and remove. */
export function FrontsTable({ form, setForm }: { form: FrontsForm; setForm: Setter }) {
  const patch = (k: number, p: Partial<FrontRow>) =>
    setForm((f) => ({ ...f, fronts: f.fronts.map((x, j) => (j === k ? { ...x, ...p } : x)) }));
  const cur = form.currency.trim();
  return (
    <fieldset>
      <legend>Fronts</legend>
      <p className="small muted">
        Each front is its own contest (a district, an account, a tender) with its own prize and
        form; the rivals fight all of them at once. Ratio: p = w·e^r / Σ w·e^r (Tullock 1980);
        logit: p = w·exp(k·e) / Σ w·exp(k·e) (Hirshleifer 1989).
      </p>
      <div className="table-wrap">
        <table className="editor-table" data-testid="fronts-table">
          <thead>
            <tr>
              <th scope="col">Front</th>
              <th scope="col">Prize{cur ? ` (${cur})` : ""}</th>
              <th scope="col">Form</th>
              <th scope="col">r or k</th>
              <th scope="col">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {form.fronts.map((fr, k) => (
              <tr key={k}>
                <td>
                  <TextField
                    compact
                    label={`Front ${k + 1} name`}
                    value={fr.name}
                    onChange={(v) => patch(k, { name: v })}
                    testId={`front-${k}-name`}
                  />
                </td>
                <td>
                  <TextField
                    compact
                    numeric
                    label={`Front ${k + 1} prize`}
                    value={fr.prize}
                    onChange={(v) => patch(k, { prize: v })}
                    testId={`front-${k}-prize`}
                  />
                </td>
                <td>
                  <SelectField
                    compact
                    label={`Front ${k + 1} form`}
                    value={fr.kind}
                    options={KINDS}
                    onChange={(v) => patch(k, { kind: v })}
                    testId={`front-${k}-kind`}
                  />
                </td>
                <td>
                  <TextField
                    compact
                    numeric
                    label={`Front ${k + 1} ${fr.kind === "ratio" ? "decisiveness r" : "logit scale k"}`}
                    value={fr.param}
                    onChange={(v) => patch(k, { param: v })}
                    testId={`front-${k}-param`}
                  />
                </td>
                <td>
                  <button
                    type="button"
                    onClick={() => setForm((f) => removeFront(f, k))}
                    disabled={form.fronts.length <= 1}
                    aria-label={`Remove front ${fr.name || k + 1}`}
                    data-testid={`front-${k}-remove`}
                  >
                    Remove
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <button type="button" onClick={() => setForm(addFront)} data-testid="front-add">
        Add front
      </button>
    </fieldset>
  );
}
