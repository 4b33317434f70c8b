"use client";

import { useEffect } from "react";
import type { AxisSpec, Scenario } from "@contend/solver";
import { encodeExplorer } from "../lib/explorerState";
import type { RangeForm } from "../lib/rangeForm";

/** Quiet time after the last edit before the address bar is rewritten. */
export const ADDRESS_SYNC_DELAY_MS = 300;

/**
 * The address bar follows the explorer's last valid state, so that the link is the view
 * (replaceState: no history entry per keystroke).
 */
export function useAddressBarSync(
  scenario: Scenario | null,
  spec: AxisSpec,
  profile: number[] | null,
  ranges: RangeForm | null = null,
) {
  useEffect(() => {
    if (!scenario) return;
    const t = setTimeout(() => {
      const pf = profile && profile.length === scenario.rivals.length ? profile : null;
      const s = encodeExplorer({ sc: scenario, sw: spec, pf, rg: ranges });
      const url = `${window.location.pathname}?s=${s}`;
      if (url !== `${window.location.pathname}${window.location.search}`)
        window.history.replaceState(null, "", url);
    }, ADDRESS_SYNC_DELAY_MS);
    return () => clearTimeout(t);
  }, [scenario, spec, profile, ranges]);
}
