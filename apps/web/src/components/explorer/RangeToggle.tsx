"use client";

import { useId } from "react";
import { defaultRange, type RangeField, type RangeText } from "../../lib/rangeForm";
import styles from "./UncertainCharts.module.css";

/**
 * The range switch under one number field of the explorer: off, the field's number is used;
 * on, the uncertainty panel draws it from a uniform or triangular range (low, most likely, high).
 */
export function RangeToggle({
  field,
  value,
  onChange,
  prize,
  error,
}: {
  field: RangeField;
  value: RangeText | undefined;
  onChange: (r: RangeText) => void;
  prize: number;
  error: string | undefined;
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
          checked={on}
          aria-label={`${field.label} is a range`}
          data-testid={`range-toggle-${field.path}`}
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
        range
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
        <p className="field-error" role="alert" id={`${id}-err`} data-testid="range-error">
          {error}
        </p>
      )}
    </div>
  );
}
