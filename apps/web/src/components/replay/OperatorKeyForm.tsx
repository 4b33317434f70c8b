"use client";

import { TextField } from "../Field";

/** "Operator key … List all": asks for every session on this server (the library, compare). */
export function OperatorKeyForm({
  value,
  onChange,
  onList,
  testId,
}: {
  value: string;
  onChange: (v: string) => void;
  /** called with the trimmed key, only when one was typed */
  onList: (operatorKey: string) => void;
  testId: string;
}) {
  return (
    <form
      className="card row no-print"
      style={{ alignItems: "flex-end", marginTop: "1rem" }}
      onSubmit={(e) => {
        e.preventDefault();
        if (value.trim()) onList(value.trim());
      }}
    >
      <TextField
        label="Operator key (lists every session on this server)"
        value={value}
        onChange={onChange}
        testId={testId}
      />
      <button type="submit" style={{ marginBottom: "1.3rem" }}>
        List all
      </button>
    </form>
  );
}
