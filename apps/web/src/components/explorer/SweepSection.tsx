"use client";

import type { Scenario, UncertainScenario } from "@contend/solver";
import { useSweepWorker } from "../../hooks/useSweepWorker";
import type { useSweepAxis } from "../../hooks/useSweepAxis";
import { sweepRows } from "../../lib/chartData";
import { SweepControls } from "./SweepControls";
import { SweepResults } from "./SweepResults";
import { SweepBands } from "./SweepBands";

/**
 * Sweeps one parameter over a range (run in a Web Worker, re-run as the scenario changes) and
 * shows the equilibrium along it.
 */
export function SweepSection({
  scenario,
  sweepAxis,
  uncertain = null,
}: {
  scenario: Scenario | null;
  sweepAxis: ReturnType<typeof useSweepAxis>;
  /** the scenario with its switched-on ranges, when it has any: the sweep can show bands */
  uncertain?: UncertainScenario | null;
}) {
  const { axis, setAxis, spec, paramOptions, paramLabel, pickParam } = sweepAxis;
  const sweep = useSweepWorker(scenario, spec, true);
  const names = scenario?.rivals.map((r) => r.name) ?? [];
  const rows = sweep.state.status === "done" ? sweepRows(sweep.state.sweep) : [];
  return (
    <section className="card" aria-labelledby="sweep-title">
      <h2 id="sweep-title">Sweep a parameter</h2>
      <SweepControls
        axis={axis}
        setAxis={setAxis}
        paramOptions={paramOptions}
        pickParam={pickParam}
        state={sweep.state}
        run={sweep.run}
        cancel={sweep.cancel}
      />
      <SweepResults rows={rows} names={names} paramLabel={paramLabel} />
      {scenario && uncertain && (
        <SweepBands scenario={scenario} uncertain={uncertain} spec={spec} paramLabel={paramLabel} />
      )}
    </section>
  );
}
