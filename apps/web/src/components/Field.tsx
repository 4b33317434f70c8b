"use client";

import { useId } from "react";
import type { ReactNode } from "react";

interface TextFieldProps {
  label: string;
  value: string;
  onChange: (v: string) => void;
  error?: string | undefined;
  hint?: ReactNode;
  numeric?: boolean;
  placeholder?: string;
  testId?: string;
  /** hide the visible label (tables); the input keeps it as its accessible name */
  compact?: boolean;
  width?: string;
  disabled?: boolean;
}

/**
 * A labelled text input with its validation message underneath. Numbers are typed as text
 * (inputMode decimal) so that what the user typed stays visible and the validator can name it.
 */
export function TextField(props: TextFieldProps) {
  const id = useId();
  const errId = `${id}-err`;
  return (
    <div className="field" style={props.width ? { width: props.width } : undefined}>
      {props.compact ? null : (
        <label htmlFor={id}>
          {props.label}
          {props.hint ? <span className="hint"> {props.hint}</span> : null}
        </label>
      )}
      <input
        id={id}
        type="text"
        inputMode={props.numeric ? "decimal" : undefined}
        autoComplete="off"
        value={props.value}
        placeholder={props.placeholder}
        aria-label={props.compact ? props.label : undefined}
        aria-invalid={props.error ? true : undefined}
        aria-describedby={props.error ? errId : undefined}
        data-testid={props.testId}
        disabled={props.disabled}
        onChange={(e) => props.onChange(e.target.value)}
      />
      <span className="field-error" id={errId} role={props.error ? "alert" : undefined}>
        {props.error ?? ""}
      </span>
    </div>
  );
}

interface SelectFieldProps<T extends string> {
  label: string;
  value: T;
  options: readonly { value: T; label: string }[];
  onChange: (v: T) => void;
  error?: string | undefined;
  compact?: boolean;
  testId?: string;
  disabled?: boolean;
}

export function SelectField<T extends string>(props: SelectFieldProps<T>) {
  const id = useId();
  const errId = `${id}-err`;
  return (
    <div className="field">
      {props.compact ? null : <label htmlFor={id}>{props.label}</label>}
      <select
        id={id}
        value={props.value}
        aria-label={props.compact ? props.label : undefined}
        aria-invalid={props.error ? true : undefined}
        aria-describedby={props.error ? errId : undefined}
        data-testid={props.testId}
        disabled={props.disabled}
        onChange={(e) => props.onChange(e.target.value as T)}
      >
        {optionsOf(props.options)}
      </select>
      <span className="field-error" id={errId}>
        {props.error ?? ""}
      </span>
    </div>
  );
}

/** The `<option>`s of a select over fixed values. */
function optionsOf<T extends string>(options: readonly { value: T; label: string }[]) {
  return options.map((o) => (
    <option key={o.value} value={o.value}>
      {o.label}
    </option>
  ));
}

/**
 * A compact control in a row of filters or options (the library's search bar, saving to the
 * library): a small caption above it, the whole wrapped in its label.
 */
export function FilterField({
  label,
  grow,
  children,
}: {
  label: string;
  /** take the row's spare width (text inputs) */
  grow?: boolean;
  children: ReactNode;
}) {
  return (
    <label className={grow ? "filter-field grow" : "filter-field"}>
      <span className="small">{label}</span>
      {children}
    </label>
  );
}

/** A FilterField holding a select over fixed values. */
export function FilterSelect<T extends string>(props: {
  label: string;
  value: T;
  options: readonly { value: T; label: string }[];
  onChange: (v: T) => void;
  testId: string;
}) {
  return (
    <FilterField label={props.label}>
      <select
        value={props.value}
        onChange={(e) => props.onChange(e.target.value as T)}
        data-testid={props.testId}
      >
        {optionsOf(props.options)}
      </select>
    </FilterField>
  );
}

interface RadioGroupProps<T extends string> {
  legend: string;
  name: string;
  value: T;
  options: readonly { value: T; label: string }[];
  onChange: (v: T) => void;
  testId?: string;
}

/** Segmented radio buttons: arrow keys move between options (native radio behaviour). */
export function RadioGroup<T extends string>(props: RadioGroupProps<T>) {
  return (
    <div className="field" role="radiogroup" aria-label={props.legend} data-testid={props.testId}>
      <span style={{ fontWeight: 500 }}>{props.legend}</span>
      <div className="segmented">
        {props.options.map((o) => (
          <label key={o.value}>
            <input
              type="radio"
              name={props.name}
              value={o.value}
              checked={props.value === o.value}
              onChange={() => props.onChange(o.value)}
            />
            {o.label}
          </label>
        ))}
      </div>
    </div>
  );
}
