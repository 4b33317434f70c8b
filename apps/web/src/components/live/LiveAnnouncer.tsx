"use client";

import { useEffect, useRef, useState } from "react";
import type { RoleView } from "@contend/protocol";
import { announcement } from "../../lib/roomState";

/**
 * A polite live region that says, once, what just happened (round opened, revealed, paused,
 * resumed, ended, the contest changed by a shock), so people using a screen reader hear it without hunting for it.
 */
export function LiveAnnouncer({ view }: { view: RoleView }) {
  const previous = useRef<RoleView | null>(null);
  const [text, setText] = useState("");
  useEffect(() => {
    const said = announcement(previous.current, view);
    previous.current = view;
    if (said) setText(said);
  }, [view]);
  return (
    <p className="sr-only" role="status" aria-live="polite" data-testid="live-announcement">
      {text}
    </p>
  );
}
