"use client";

import { useCallback, useState } from "react";
import type { Command } from "@contend/protocol";
import type { SessionHandle } from "./useSession";
import { plainAckError } from "../lib/roomState";

export interface Notice {
  ok: boolean;
  text: string;
}

/**
 * The facilitator's commands: one at a time (`busy` disables every control while one is in
 * flight), each ending in a notice in plain words.
 */
export function useConsoleCommands(send: SessionHandle["send"]) {
  const [busy, setBusy] = useState(false);
  const [notice, setNotice] = useState<Notice | null>(null);
  const run = useCallback(
    async (cmd: Command, done: string): Promise<boolean> => {
      setBusy(true);
      const ack = await send(cmd);
      setBusy(false);
      setNotice(ack.ok ? { ok: true, text: done } : { ok: false, text: plainAckError(ack) });
      return ack.ok;
    },
    [send],
  );
  return { busy, notice, setNotice, run };
}
