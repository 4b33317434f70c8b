"use client";

import Link from "next/link";
import { useDeferredValue, useMemo, useState } from "react";
import { useSearchParams } from "next/navigation";
import { decodeExplorer, initialState } from "../lib/explorerState";
import type { ExplorerState } from "../lib/explorerState";
import { shownAnswer } from "../lib/solveState";
import { useAddressBarSync } from "../hooks/useAddressBarSync";
import { useCopyLink } from "../hooks/useCopyLink";
import { useExplorerRanges } from "../hooks/useExplorerRanges";
import { useExplorerScenario } from "../hooks/useExplorerScenario";
import { useExplorerSolve } from "../hooks/useExplorerSolve";
import { useSweepAxis } from "../hooks/useSweepAxis";
import { ContestFields, RivalsTable } from "./ContestFields";
import { BestResponseSection, hasReactionCurves } from "./explorer/BestResponseSection";
import { EquilibriumCard } from "./explorer/EquilibriumCard";
import { StaticsSection } from "./explorer/StaticsSection";
import { SweepSection } from "./explorer/SweepSection";
import { TimingFields } from "./explorer/TimingFields";
import { UncertaintySection } from "./explorer/UncertaintySection";
import { AboutTheMaths } from "./AboutTheMaths";

/**
 * The equilibrium explorer: edit a scenario and see its equilibrium, two rivals' best-response
 * curves, a one-parameter sweep and the comparative statics. The page address holds the view.
 */
export function Explorer() {
  const params = useSearchParams();
  const initial = useMemo<ExplorerState>(
    () => decodeExplorer(params.get("s")) ?? initialState(),
    [params],
  );
  const { form, setForm, leader, setLeader, errors, scenario } = useExplorerScenario(initial.sc);
  const [profile, setProfile] = useState<number[] | null>(initial.pf);
  const { copied, copyLink } = useCopyLink();

  // The heavy views follow a deferred copy so that typing stays responsive.
  const deferred = useDeferredValue(scenario);
  // The equilibrium is solved in a worker; the last answer stays (greyed) while a new one comes.
  const solve = useExplorerSolve(deferred);
  const answer = shownAnswer(solve);
  const solved =
    solve.status === "error"
      ? { ok: false as const, message: solve.message }
      : (answer?.solved ?? null);
  const solving = solve.status === "solving";
  const currency = deferred?.currency ?? null;
  const sweepAxis = useSweepAxis(initial.sw, deferred);

  const eq = solved?.ok ? solved.result.equilibrium : null;
  const eqEfforts = eq ? (eq.efforts ?? null) : null;
  const contest = solved?.ok ? solved.contest : null;
  const ranges = useExplorerRanges(form, deferred, initial.rg);
  useAddressBarSync(scenario, sweepAxis.spec, profile, ranges.ranges);

  return (
    <div>
      <div className="row" style={{ justifyContent: "space-between" }}>
        <h1>Equilibrium explorer</h1>
        <div className="row">
          <Link href="/explore/fronts">Several fronts, one budget</Link>
          <span className="small muted">The page address holds the whole view.</span>
          <button type="button" onClick={copyLink} data-testid="copy-explorer-link">
            {copied ? "Link copied" : "Copy link"}
          </button>
        </div>
      </div>
      <div className="explorer-top">
        <div>
          <ContestFields form={form} setForm={setForm} errors={errors} extra={ranges.prizeToggle} />
          <RivalsTable
            form={form}
            setForm={setForm}
            errors={errors}
            withPolicy={false}
            extra={ranges.rivalToggle}
          />
          <TimingFields form={form} leader={leader} setLeader={setLeader} error={errors.leader} />
        </div>
        <EquilibriumCard
          solved={solved}
          solving={solving}
          ms={solve.status === "done" ? solve.ms : null}
          currency={currency}
          sequential={!!deferred?.leader}
        />
      </div>

      {hasReactionCurves(contest) && (
        <BestResponseSection
          contest={contest}
          equilibrium={eqEfforts}
          profile={profile}
          setProfile={setProfile}
          currency={currency}
        />
      )}

      <SweepSection
        scenario={deferred}
        sweepAxis={sweepAxis}
        uncertain={ranges.built?.ok && ranges.built.count > 0 ? ranges.built.scenario : null}
      />
      <StaticsSection scenario={deferred} statics={answer?.statics ?? null} solving={solving} />
      <UncertaintySection
        scenario={deferred}
        ranges={ranges.ranges}
        built={ranges.built}
        fields={ranges.fields}
      />
      <AboutTheMaths method={eq?.method ?? null} />
    </div>
  );
}
