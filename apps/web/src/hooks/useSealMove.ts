"use client";

import { useEffect, useRef, useState } from "react";
import type { Ack, Command, CommandAckData } from "@contend/protocol";
import { newClientMoveId } from "../lib/live";

/**
 * Sealing a spend (or, with fronts, an allocation: money per front) with a confirmation step. The same amount again in the same round (say after
 * a timeout) reuses its clientMoveId, so the server answers with the original ack instead of
 * recording a second move (R13).
 */
/** A spend (money), or money per front in a session with fronts. */
type Move = number | number[];

export function useSealMove<M extends Move = number>(
  round: number,
  status: string,
  send: (cmd: Command) => Promise<Ack<CommandAckData>>,
) {
  const [confirming, setConfirming] = useState<M | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const pending = useRef<{ round: number; move: string; reason: string; id: string } | null>(null);

  // A new round (or a reveal) clears any half-finished confirmation.
  useEffect(() => {
    setConfirming(null);
    setError(null);
  }, [round, status]);

  /** `reason`: the seat's optional one-line reason (R26), revealed with the round. */
  async function seal(spend: M, reason = ""): Promise<boolean> {
    setBusy(true);
    setError(null);
    const p = pending.current;
    const trimmed = reason.trim();
    const move = JSON.stringify(spend);
    const same = p && p.round === round && p.move === move && p.reason === trimmed;
    const id = same ? p.id : newClientMoveId();
    pending.current = { round, move, reason: trimmed, id };
    const ack = await send({
      type: "sealMove",
      clientMoveId: id,
      ...(typeof spend === "number" ? { spend } : { frontSpends: spend }),
      round,
      ...(trimmed ? { reason: trimmed } : {}),
    });
    setBusy(false);
    if (ack.ok) {
      setConfirming(null);
      return true;
    }
    setError(ack.message);
    return false;
  }

  return { confirming, setConfirming, busy, error, seal };
}
