"use client";

import { useState } from "react";

/** How long a "Copied" acknowledgement stays on a copy button (links, invite fields). */
export const COPIED_NOTICE_MS = 1500;

/** Copies the page address to the clipboard; `copied` is true for a moment afterwards. */
export function useCopyLink() {
  const [copied, setCopied] = useState(false);
  async function copyLink() {
    try {
      await navigator.clipboard.writeText(window.location.href);
      setCopied(true);
      setTimeout(() => setCopied(false), COPIED_NOTICE_MS);
    } catch {
      setCopied(false);
    }
  }
  return { copied, copyLink };
}
