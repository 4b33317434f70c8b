"use client";

import { useEffect, useMemo, useState } from "react";
import type { AxisSpec, Scenario } from "@contend/solver";
import { defaultAxis, sweepParams } from "../lib/explorerState";

/** The sweep axis as typed: every field keeps its text so that a half-typed number survives. */
export interface AxisText {
  param: string;
  from: string;
  to: string;
  steps: string;
}

function axisText(a: AxisSpec): AxisText {
  return { param: a.param, from: String(a.from), to: String(a.to), steps: String(a.steps) };
}

/**
 * The swept parameter and its range for the explorer: the typed fields, the parsed spec, the
 * parameters the scenario offers, and picking a parameter (which resets the range to its
 * default). An axis left pointing at nothing (a rival removed) resets to the first parameter.
 */
export function useSweepAxis(initial: AxisSpec, scenario: Scenario | null) {
  const [axis, setAxis] = useState<AxisText>(() => axisText(initial));

  const spec = useMemo<AxisSpec>(
    () => ({
      param: axis.param,
      from: Number(axis.from),
      to: Number(axis.to),
      steps: Number(axis.steps),
    }),
    [axis],
  );

  const paramOptions = useMemo(() => (scenario ? sweepParams(scenario) : []), [scenario]);
  useEffect(() => {
    // A removed rival or a changed form can leave the axis pointing nowhere: reset it.
    if (scenario && paramOptions.length > 0 && !paramOptions.some((o) => o.path === axis.param)) {
      setAxis(axisText(defaultAxis(scenario, paramOptions[0]?.path ?? "prize")));
    }
  }, [scenario, paramOptions, axis.param]);

  function pickParam(param: string) {
    if (!scenario) return;
    setAxis(axisText(defaultAxis(scenario, param, Number(axis.steps) || undefined)));
  }

  const paramLabel = paramOptions.find((o) => o.path === axis.param)?.label ?? axis.param;
  return { axis, setAxis, spec, paramOptions, paramLabel, pickParam };
}
