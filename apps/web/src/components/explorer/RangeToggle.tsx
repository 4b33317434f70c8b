"use client";

import { useId } from "react";
import { defaultRange, type RangeField, type RangeText } from "../../lib/rangeForm";
import styles from "./UncertainCharts.module.css";

/**
 * The range switch under one number field of the explorer: off, the field's number is used;
 * on, the uncertainty panel draws it from a uniform or triangular range (low, most likely, high).
 * The session editor uses the same switch for private numbers (`word` "private", its own ids).
 */
export function RangeToggle({
  field,
  value,
  onChange,
  prize,
  error,
  word = "range",
  unit,
  ids = { toggle: `range-toggle-${field.path}`, error: "range-error" },
}: {
  field: RangeField;
  value: RangeText | undefined;
  onChange: (r: RangeText) => void;
  prize: number;
  error: string | undefined;
  /** the switch's word ("range"; the editor: "private") */
  word?: string;
  /** what the ends are counted in ("$ per unit of effort"), shown above them */
  unit?: string;
  /** test ids of the switch and the error (defaults: range-toggle-<path>, range-error) */
  ids?: { toggle: string; error: string };
}) {
  const id = useId();
  const on = value?.on ?? false;
  const set = (patch: Partial<RangeText>) => value && onChange({ ...value, ...patch });
  type End = ["low" | "mode" | "high", string, string];
  const ends: End[] = [["low", "low", `Low of ${field.label}`]];
  if (value?.dist === "triangular") ends.push(["mode", "likely", `Most likely ${field.label}`]);
  ends.push(["high", "high", `High of ${field.label}`]);
  return (
    <div>
      <label className={styles.toggle}>
        <input
          type="checkbox"
          style={{ width: "auto", minWidth: 0 }}
          checked={on}
          aria-label={`${field.label} is ${word === "range" ? "a range" : word}`}
          data-testid={ids.toggle}
          onChange={(e) =>
            onChange(
              e.target.checked
                ? value
                  ? { ...value, on: true }
                  : defaultRange(field, prize)
                : { ...(value ?? defaultRange(field, prize)), on: false },
            )
          }
        />
        {word}
      </label>
      {on && value && (
        <div className={styles.rangeBox}>
          <select
            aria-label={`Distribution of ${field.label}`}
            value={value.dist}
            onChange={(e) => set({ dist: e.target.value as RangeText["dist"] })}
          >
            <option value="uniform">Uniform</option>
            <option value="triangular">Triangular</option>
          </select>
          {unit && <span style={{ gridColumn: "1 / -1" }}>in {unit}</span>}
          {ends.map(([key, short, label]) => (
            <label key={key} style={{ display: "contents" }}>
              <span>{short}</span>
              <input
                type="text"
                inputMode="decimal"
                autoComplete="off"
                aria-label={label}
                aria-invalid={error ? true : undefined}
                aria-describedby={error ? `${id}-err` : undefined}
                value={value[key]}
                onChange={(e) => set({ [key]: e.target.value })}
              />
            </label>
          ))}
        </div>
      )}
      {error && (
        <p className="field-error" role="alert" id={`${id}-err`} data-testid={ids.error}>
          {error}
        </p>
      )}
    </div>
  );
}
