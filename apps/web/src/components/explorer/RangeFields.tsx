"use client";

import type { Dispatch, SetStateAction } from "react";
import { formatMoney, formatNumber } from "../../lib/format";
import {
  defaultRange,
  type RangeField,
  type RangeForm,
  type RangeText,
} from "../../lib/range-form";
import { SelectField, TextField } from "../Field";

/**
 * One row per field that may be uncertain: a toggle, and when it is on the distribution and its
 * ends (the value above stays the point used everywhere else in the explorer).
 */
export function RangeFields({
  fields,
  ranges,
  setRanges,
  prize,
  currency,
  error,
}: {
  fields: RangeField[];
  ranges: RangeForm;
  setRanges: Dispatch<SetStateAction<RangeForm>>;
  prize: number;
  currency: string | null;
  error: { field: string; message: string } | null;
}) {
  const set = (path: string, patch: Partial<RangeText>) =>
    setRanges((all) => ({ ...all, [path]: { ...(all[path] as RangeText), ...patch } }));
  return (
    <div className="stack" data-testid="range-fields">
      {fields.map((f) => {
        const r = ranges[f.path];
        const on = r?.on ?? false;
        const unit = f.unit === "money" ? ` (${currency || "money"})` : "";
        const point =
          f.point === null
            ? "no cap"
            : f.unit === "money"
              ? formatMoney(f.point, currency)
              : formatNumber(f.point);
        return (
          <div key={f.path} className="row" style={{ alignItems: "flex-start", gap: "0.5rem" }}>
            <label className="row" style={{ minWidth: "16rem", gap: "0.4rem" }}>
              <input
                type="checkbox"
                checked={on}
                data-testid={`range-toggle-${f.path}`}
                onChange={(e) =>
                  setRanges((all) => ({
                    ...all,
                    [f.path]: e.target.checked
                      ? all[f.path]
                        ? { ...all[f.path]!, on: true }
                        : defaultRange(f, prize)
                      : { ...(all[f.path] as RangeText), on: false },
                  }))
                }
              />
              <span>
                {f.label}
                {unit}: <span className="muted">{on ? "range" : point}</span>
              </span>
            </label>
            {on && r && (
              <>
                <SelectField
                  label="Distribution"
                  compact
                  value={r.dist}
                  options={[
                    { value: "uniform", label: "Uniform" },
                    { value: "triangular", label: "Triangular" },
                  ]}
                  onChange={(v) => set(f.path, { dist: v })}
                />
                <TextField
                  label={`Low of ${f.label}`}
                  compact
                  numeric
                  width="6.5rem"
                  value={r.low}
                  onChange={(v) => set(f.path, { low: v })}
                  placeholder="low"
                />
                {r.dist === "triangular" && (
                  <TextField
                    label={`Most likely ${f.label}`}
                    compact
                    numeric
                    width="6.5rem"
                    value={r.mode}
                    onChange={(v) => set(f.path, { mode: v })}
                    placeholder="most likely"
                  />
                )}
                <TextField
                  label={`High of ${f.label}`}
                  compact
                  numeric
                  width="6.5rem"
                  value={r.high}
                  onChange={(v) => set(f.path, { high: v })}
                  placeholder="high"
                />
              </>
            )}
            {error && error.field === f.path && (
              <p className="field-error" role="alert" data-testid="range-error">
                {error.message}
              </p>
            )}
          </div>
        );
      })}
    </div>
  );
}
