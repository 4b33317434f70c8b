"use client";

import { useMemo, useRef } from "react";
import type { Contest } from "@contend/solver";
import { bestResponseCurves, curveRange } from "../../lib/brCurves";
import { formatNumber } from "../../lib/format";
import { DataTable } from "../DataTable";
import { ReactionChart } from "../ReactionChart";
import { ChartSlideDownload } from "../ChartSlideDownload";
import { seriesColour } from "../../lib/palette";
import { ProfileInputs } from "./ProfileInputs";
import { ProfileTable } from "./ProfileTable";
import { Term } from "../Glossary";

/** Whether the best-response curves apply: two rivals and a contest with pure best replies. */
export function hasReactionCurves(contest: Contest | null): contest is Contest {
  return contest !== null && contest.rivals.length === 2 && contest.csf.kind !== "allpay";
}

/** Sampled rows of the curves table: one in this many curve points. */
const TABLE_EVERY = 10;

/**
 * Two rivals' best-response curves, where they cross (the equilibrium), and a profile the user
 * picks on the chart or types, evaluated for each rival.
 */
export function BestResponseSection({
  contest,
  equilibrium,
  profile,
  setProfile,
  currency,
}: {
  contest: Contest;
  equilibrium: number[] | null;
  profile: number[] | null;
  setProfile: (p: number[] | null) => void;
  currency: string | null;
}) {
  const curves = useMemo(() => {
    const max = curveRange(contest, equilibrium, profile);
    return { max, curves: bestResponseCurves(contest, max) };
  }, [contest, equilibrium, profile]);
  const chartRef = useRef<HTMLDivElement>(null);
  const names: [string, string] = [
    contest.rivals[0]?.name ?? "Rival 1",
    contest.rivals[1]?.name ?? "Rival 2",
  ];

  return (
    <section className="card" aria-labelledby="br-title">
      <h2 id="br-title">Best-response curves</h2>
      <p className="small muted">
        Each curve is one rival&apos;s <Term id="best-reply">best reply</Term> to the other&apos;s{" "}
        <Term id="effort">effort</Term>; they cross at the <Term id="equilibrium">equilibrium</Term>
        . Click a point (or focus the chart and use the arrow keys) to test a profile.
      </p>
      <div className="grid-2">
        <div>
          <div ref={chartRef}>
            <ReactionChart
              curves={curves.curves}
              max={curves.max}
              names={names}
              equilibrium={equilibrium}
              profile={profile}
              onPick={setProfile}
              format={(v) => formatNumber(v, v >= 100 ? 0 : 2)}
            />
          </div>
          <ChartSlideDownload
            chartRef={chartRef}
            slide={{
              title: `Best replies of ${names[0]} and ${names[1]}`,
              caption: `Each curve is one rival's best effort given the other's; where they cross is the equilibrium (the dot)${profile ? ", the ring is the profile picked" : ""}. Effort in model units; the contest's other inputs held fixed.`,
            }}
            units={`Across: effort of ${names[0]} · up: effort of ${names[1]} (model units)`}
            legend={[
              { name: `best reply of ${names[0]}`, colour: seriesColour(0) },
              { name: `best reply of ${names[1]}`, colour: seriesColour(1), dashed: true },
            ]}
            testId="reaction-chart"
          />
        </div>
        <div>
          <div className="row">
            <ProfileInputs
              names={[contest.rivals[0]?.name ?? "rival 1", contest.rivals[1]?.name ?? "rival 2"]}
              profile={profile}
              fallback={equilibrium ?? [0, 0]}
              onChange={setProfile}
            />
          </div>
          <ProfileTable contest={contest} profile={profile} currency={currency} />
          {profile && (
            <button type="button" className="small" onClick={() => setProfile(null)}>
              Clear profile
            </button>
          )}
        </div>
      </div>
      <DataTable
        caption="Best-response curves (sampled)"
        testId="br-table"
        maxHeight={180}
        columns={[
          { key: "t", label: "Other's effort", format: (v) => formatNumber(v) },
          {
            key: "br0",
            label: `Best reply of ${contest.rivals[0]?.name}`,
            format: (v) => formatNumber(v),
          },
          {
            key: "br1",
            label: `Best reply of ${contest.rivals[1]?.name}`,
            format: (v) => formatNumber(v),
          },
        ]}
        rows={curves.curves[0]
          .filter((_, k) => k % TABLE_EVERY === 0)
          .map((p, k) => ({
            t: p.e1,
            br0: p.e0,
            br1: curves.curves[1][k * TABLE_EVERY]?.e1 ?? null,
          }))}
      />
    </section>
  );
}
