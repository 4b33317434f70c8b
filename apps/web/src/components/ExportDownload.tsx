"use client";

import { useState } from "react";
import { exportFile } from "../lib/api";
import { saveBlob } from "../lib/saveFile";

/**
 * Saves a session's export. The key goes in the request's Authorization header, so the file is
 * fetched by script and handed to the browser as a download (a plain link would need the key
 * in its URL).
 */
export function ExportDownload({
  sessionId,
  accessKey,
  format,
  label,
  className,
  testId,
}: {
  sessionId: string;
  accessKey: string;
  format: "json" | "csv";
  label: string;
  className?: string;
  testId?: string;
}) {
  const [error, setError] = useState<string | null>(null);
  async function save() {
    setError(null);
    const r = await exportFile(sessionId, accessKey, format);
    if (!r.ok) return setError(r.message);
    saveBlob(r.data.blob, r.data.fileName);
  }
  return (
    <>
      <button type="button" className={className} onClick={() => void save()} data-testid={testId}>
        {label}
      </button>
      {error && (
        <span className="notice error small" role="alert">
          {error}
        </span>
      )}
    </>
  );
}
