"use client";

import { useId, useState } from "react";
import { COPIED_NOTICE_MS } from "../hooks/useCopyLink";

/** A read-only value with a copy button; the label names what is copied. */
export function CopyField({
  label,
  value,
  testId,
}: {
  label: string;
  value: string;
  testId?: string;
}) {
  const id = useId();
  const [copied, setCopied] = useState(false);
  async function copy() {
    try {
      await navigator.clipboard.writeText(value);
      setCopied(true);
      setTimeout(() => setCopied(false), COPIED_NOTICE_MS);
    } catch {
      // Clipboard may be blocked (insecure origin): select the text so the user can copy it.
      const el = document.getElementById(id) as HTMLInputElement | null;
      el?.select();
    }
  }
  return (
    <div className="field">
      <label htmlFor={id}>{label}</label>
      <div className="copy-row">
        <input
          id={id}
          type="text"
          readOnly
          value={value}
          data-testid={testId}
          onFocus={(e) => e.currentTarget.select()}
        />
        <button type="button" className="small" onClick={copy} aria-label={`Copy ${label}`}>
          {copied ? "Copied" : "Copy"}
        </button>
      </div>
    </div>
  );
}
