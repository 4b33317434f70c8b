"use client";

import { useDeferredValue, useEffect, useMemo, useState } from "react";
import { useSearchParams } from "next/navigation";
import { comparativeStatics, respond, shares, validateScenario } from "@contend/solver";
import type { AxisSpec, Scenario } from "@contend/solver";
import { bestResponseCurves, curveRange } from "../lib/br-curves";
import { effortKey, payoffKey, sweepRows, turningPoints } from "../lib/chart-data";
import { contestErrors, formToContestRaw, scenarioToForm } from "../lib/editor-form";
import type { EditorForm } from "../lib/editor-form";
import {
  decodeExplorer,
  defaultAxis,
  encodeExplorer,
  initialState,
  sweepParams,
} from "../lib/explorer-state";
import type { ExplorerState } from "../lib/explorer-state";
import { formatMoney, formatNumber, formatPercent, formatPlain, formatSigned } from "../lib/format";
import { seriesColour } from "../lib/palette";
import { solveForView } from "../lib/solve-view";
import { useChunkedSweep } from "../hooks/useChunkedSweep";
import { ContestFields, RivalsTable } from "./ContestFields";
import { DataTable } from "./DataTable";
import { SolvedEquilibrium } from "./EquilibriumTable";
import { SelectField, TextField } from "./Field";
import { LineSeriesChart } from "./LineSeriesChart";
import { ReactionChart } from "./ReactionChart";
import { FigureTable, numCol, RowHeader, textCol } from "./FigureTable";

/**
 * The two profile fields keep their own text (so "1." can be typed) and follow the profile when
 * it changes elsewhere (a click on the chart).
 */
function ProfileInputs({
  names,
  profile,
  fallback,
  onChange,
}: {
  names: [string, string];
  profile: number[] | null;
  fallback: readonly number[];
  onChange: (p: number[]) => void;
}) {
  const shown = (i: number) => (profile ? String(Number((profile[i] ?? 0).toPrecision(6))) : "");
  const [text, setText] = useState<[string, string]>([shown(0), shown(1)]);
  const key = profile ? profile.join(",") : "";
  useEffect(() => {
    setText((t) => {
      const same = (i: number) =>
        profile !== null && Number(t[i]) === Number((profile[i] ?? 0).toPrecision(6));
      return same(0) && same(1) ? t : [shown(0), shown(1)];
    });
  }, [key]);
  return (
    <>
      {[0, 1].map((i) => (
        <TextField
          key={i}
          numeric
          label={`Profile effort of ${names[i as 0 | 1]}`}
          value={text[i as 0 | 1]}
          placeholder="click the chart"
          onChange={(v) => {
            setText((t) => (i === 0 ? [v, t[1]] : [t[0], v]));
            const x = Number(v);
            if (v.trim() === "" || !Number.isFinite(x) || x < 0) return;
            const next = profile ? [...profile] : [...fallback];
            next[i] = x;
            onChange(next);
          }}
          testId={`profile-input-${i}`}
          width="12rem"
        />
      ))}
    </>
  );
}

function formOf(s: Scenario): EditorForm {
  return scenarioToForm({ ...s, session: {} });
}

/** The form's scenario with the leader choice, or null while a field is invalid. */
function scenarioOf(form: EditorForm, leader: string): Scenario | null {
  const raw = { ...formToContestRaw(form), leader: leader === "" ? null : leader };
  const r = validateScenario(raw);
  return r.ok ? r.value : null;
}

export function Explorer() {
  const params = useSearchParams();
  const initial = useMemo<ExplorerState>(
    () => decodeExplorer(params.get("s")) ?? initialState(),
    [params],
  );
  const [form, setForm] = useState<EditorForm>(() => formOf(initial.sc));
  const [leader, setLeader] = useState<string>(initial.sc.leader ?? "");
  const [axis, setAxis] = useState<{ param: string; from: string; to: string; steps: string }>(
    () => ({
      param: initial.sw.param,
      from: String(initial.sw.from),
      to: String(initial.sw.to),
      steps: String(initial.sw.steps),
    }),
  );
  const [profile, setProfile] = useState<number[] | null>(initial.pf);
  const [copied, setCopied] = useState(false);

  const errors = useMemo(() => {
    const raw = { ...formToContestRaw(form), leader: leader === "" ? null : leader };
    return contestErrors(raw);
  }, [form, leader]);
  const scenarioKey = JSON.stringify(scenarioOf(form, leader));
  // Keyed by content so that a re-render with the same numbers reuses every computation.
  const scenario = useMemo<Scenario | null>(
    () => JSON.parse(scenarioKey) as Scenario | null,
    [scenarioKey],
  );
  const deferred = useDeferredValue(scenario);
  const solved = useMemo(() => (deferred ? solveForView(deferred) : null), [deferred]);
  const currency = deferred?.currency ?? null;
  const money = (v: number) => formatMoney(v, currency);

  const spec = useMemo<AxisSpec>(
    () => ({
      param: axis.param,
      from: Number(axis.from),
      to: Number(axis.to),
      steps: Number(axis.steps),
    }),
    [axis],
  );
  const sweep = useChunkedSweep(deferred, spec, true);

  // Address bar follows the last valid state (replaceState: no history entry per keystroke).
  useEffect(() => {
    if (!scenario) return;
    const t = setTimeout(() => {
      const pf = profile && profile.length === scenario.rivals.length ? profile : null;
      const s = encodeExplorer({ sc: scenario, sw: spec, pf });
      const url = `${window.location.pathname}?s=${s}`;
      if (url !== `${window.location.pathname}${window.location.search}`)
        window.history.replaceState(null, "", url);
    }, 300);
    return () => clearTimeout(t);
  }, [scenario, spec, profile]);

  const paramOptions = useMemo(() => (deferred ? sweepParams(deferred) : []), [deferred]);
  useEffect(() => {
    // A removed rival or a changed form can leave the axis pointing nowhere: reset it.
    if (deferred && paramOptions.length > 0 && !paramOptions.some((o) => o.path === axis.param)) {
      const d = defaultAxis(deferred, paramOptions[0]?.path ?? "prize");
      setAxis({ param: d.param, from: String(d.from), to: String(d.to), steps: String(d.steps) });
    }
  }, [deferred, paramOptions, axis.param]);

  const eq = solved?.ok ? solved.result.equilibrium : null;
  const eqEfforts = eq ? (eq.efforts ?? null) : null;
  const contest = solved?.ok ? solved.contest : null;
  const two = contest !== null && contest.rivals.length === 2 && contest.csf.kind !== "allpay";

  const curves = useMemo(() => {
    if (!two || !contest) return null;
    const max = curveRange(contest, eqEfforts, profile);
    return { max, curves: bestResponseCurves(contest, max) };
  }, [two, contest, eqEfforts, profile]);

  const profileEval = useMemo(() => {
    if (!contest || !profile || profile.length !== contest.rivals.length) return null;
    return { ...respond(contest, profile), shares: shares(contest, profile) };
  }, [contest, profile]);

  const statics = useMemo(() => {
    if (!deferred || deferred.leader) return null;
    if (deferred.rivals.length > 8)
      return {
        ok: false as const,
        path: "",
        message: "comparative statics are shown for up to 8 rivals",
      };
    try {
      return comparativeStatics(deferred);
    } catch (e) {
      return { ok: false as const, path: "", message: `solver failed: ${(e as Error).message}` };
    }
  }, [deferred]);

  async function copyLink() {
    try {
      await navigator.clipboard.writeText(window.location.href);
      setCopied(true);
      setTimeout(() => setCopied(false), 1500);
    } catch {
      setCopied(false);
    }
  }

  function pickParam(param: string) {
    if (!deferred) return;
    const d = defaultAxis(deferred, param, Number(axis.steps) || 61);
    setAxis({ param: d.param, from: String(d.from), to: String(d.to), steps: String(d.steps) });
  }

  const names = deferred?.rivals.map((r) => r.name) ?? [];
  const rows = sweep.state.status === "done" ? sweepRows(sweep.state.sweep) : [];
  const paramLabel = paramOptions.find((o) => o.path === axis.param)?.label ?? axis.param;
  const axisError = sweep.state.status === "error" ? sweep.state : null;
  const axisErr = (k: string) =>
    axisError && axisError.path === `sweep.${k}` ? axisError.message : undefined;

  return (
    <div>
      <div className="row" style={{ justifyContent: "space-between" }}>
        <h1>Equilibrium explorer</h1>
        <div className="row">
          <span className="small muted">The page address holds the whole view.</span>
          <button type="button" onClick={copyLink} data-testid="copy-explorer-link">
            {copied ? "Link copied" : "Copy link"}
          </button>
        </div>
      </div>
      <div className="explorer-top">
        <div>
          <ContestFields form={form} setForm={setForm} errors={errors} />
          <RivalsTable form={form} setForm={setForm} errors={errors} withPolicy={false} />
          <fieldset>
            <legend>Timing</legend>
            <SelectField
              label="Who moves first"
              value={leader}
              options={[
                { value: "", label: "Simultaneous moves" },
                ...form.rivals.map((r) => ({
                  value: r.name.trim(),
                  label: `${r.name.trim() || "(unnamed)"} commits first, the others follow`,
                })),
              ]}
              onChange={setLeader}
              error={errors.leader}
              testId="field-leader"
            />
            <p className="small muted">
              With a leader, the others see its effort and best-respond; the leader chooses knowing
              that (Dixit 1987).
            </p>
          </fieldset>
        </div>
        <section className="card" aria-labelledby="eq-title">
          <h2 id="eq-title">{deferred?.leader ? "Leader-follower outcome" : "Equilibrium"}</h2>
          <SolvedEquilibrium
            solved={solved}
            currency={currency}
            testPrefix="eq"
            more={(ok) =>
              ok.result.alternatives.length > 0 && (
                <div data-testid="eq-alternatives">
                  <h3>Further equilibria</h3>
                  {ok.result.alternatives.map((alt, k) => (
                    <p key={k} className="small">
                      {k + 2}. efforts{" "}
                      {(alt.efforts ?? alt.expectedEfforts ?? []).map(money).join(", ")} ·
                      dissipation {formatPercent(alt.dissipation)}
                    </p>
                  ))}
                </div>
              )
            }
          />
        </section>
      </div>

      {two && contest && curves && (
        <section className="card" aria-labelledby="br-title">
          <h2 id="br-title">Best-response curves</h2>
          <p className="small muted">
            Each curve is one rival&apos;s best reply to the other&apos;s effort; they cross at the
            equilibrium. Click a point (or focus the chart and use the arrow keys) to test a
            profile.
          </p>
          <div className="grid-2">
            <ReactionChart
              curves={curves.curves}
              max={curves.max}
              names={[contest.rivals[0]?.name ?? "Rival 1", contest.rivals[1]?.name ?? "Rival 2"]}
              equilibrium={eqEfforts}
              profile={profile}
              onPick={setProfile}
              format={(v) => formatNumber(v, v >= 100 ? 0 : 2)}
            />
            <div>
              <div className="row">
                <ProfileInputs
                  names={[
                    contest.rivals[0]?.name ?? "rival 1",
                    contest.rivals[1]?.name ?? "rival 2",
                  ]}
                  profile={profile}
                  fallback={eqEfforts ?? [0, 0]}
                  onChange={setProfile}
                />
              </div>
              <FigureTable
                head={[
                  textCol("Rival"),
                  numCol("Share"),
                  numCol("Payoff"),
                  numCol("Best reply"),
                  numCol("Regret"),
                ]}
                caption="At the picked profile"
                testId="profile-table"
                wrapStyle={{ minHeight: "9rem" }}
              >
                {contest.rivals.map((r, i) => (
                  <tr key={i}>
                    <RowHeader>{r.name}</RowHeader>
                    <td className="num" data-testid={`profile-share-${i}`}>
                      {profileEval ? formatPercent(profileEval.shares[i] ?? NaN) : "\u2013"}
                    </td>
                    <td className="num" data-testid={`profile-payoff-${i}`}>
                      {profileEval ? money(profileEval.payoffs[i] ?? NaN) : "\u2013"}
                    </td>
                    <td className="num" data-testid={`profile-br-${i}`}>
                      {profileEval ? money(profileEval.bestResponses[i] ?? NaN) : "\u2013"}
                    </td>
                    <td className="num" data-testid={`profile-regret-${i}`}>
                      {profileEval ? money(profileEval.regrets[i] ?? NaN) : "\u2013"}
                    </td>
                  </tr>
                ))}
              </FigureTable>
              <p className="small" data-testid="profile-gap" style={{ minHeight: "1.5em" }}>
                {profileEval ? `Nash gap (largest regret): ${money(profileEval.nashGap)}` : ""}
              </p>
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
              .filter((_, k) => k % 10 === 0)
              .map((p, k) => ({ t: p.e1, br0: p.e0, br1: curves.curves[1][k * 10]?.e1 ?? null }))}
          />
        </section>
      )}

      <section className="card" aria-labelledby="sweep-title">
        <h2 id="sweep-title">Sweep a parameter</h2>
        <div className="row" style={{ alignItems: "flex-start" }}>
          <SelectField
            label="Parameter"
            value={axis.param}
            options={paramOptions.map((o) => ({ value: o.path, label: o.label }))}
            onChange={pickParam}
            error={axisErr("param")}
            testId="sweep-param"
          />
          <TextField
            label="From"
            numeric
            value={axis.from}
            onChange={(v) => setAxis((a) => ({ ...a, from: v }))}
            error={axisErr("from")}
            testId="sweep-from"
            width="9rem"
          />
          <TextField
            label="To"
            numeric
            value={axis.to}
            onChange={(v) => setAxis((a) => ({ ...a, to: v }))}
            error={axisErr("to")}
            testId="sweep-to"
            width="9rem"
          />
          <TextField
            label="Points"
            numeric
            value={axis.steps}
            onChange={(v) => setAxis((a) => ({ ...a, steps: v }))}
            error={axisErr("steps")}
            testId="sweep-steps"
            width="7rem"
          />
          <div className="field">
            <span aria-hidden="true">&nbsp;</span>
            {sweep.state.status === "running" ? (
              <button type="button" onClick={sweep.cancel} data-testid="sweep-cancel">
                Cancel
              </button>
            ) : (
              <button type="button" className="primary" onClick={sweep.run} data-testid="sweep-run">
                Run sweep
              </button>
            )}
          </div>
        </div>
        <div style={{ minHeight: "2.2rem" }} aria-live="polite">
          {sweep.state.status === "running" && (
            <div data-testid="sweep-progress">
              <div
                className="progress"
                role="progressbar"
                aria-label="Sweep progress"
                aria-valuemin={0}
                aria-valuemax={sweep.state.total}
                aria-valuenow={sweep.state.done}
              >
                <div
                  style={{ width: `${(100 * sweep.state.done) / Math.max(1, sweep.state.total)}%` }}
                />
              </div>
              <span className="small muted">
                {sweep.state.done} of {sweep.state.total} points
              </span>
            </div>
          )}
          {sweep.state.status === "done" && (
            <p className="small muted" data-testid="sweep-status">
              {sweep.state.sweep.values.length} points in {formatNumber(sweep.state.ms, 0)} ms
              {sweep.state.sweep.kinds.some((k) => k === "none-pure")
                ? " · gaps: no pure equilibrium there"
                : ""}
            </p>
          )}
          {axisError &&
            !["sweep.param", "sweep.from", "sweep.to", "sweep.steps"].includes(axisError.path) && (
              <p className="field-error">{axisError.message}</p>
            )}
        </div>
        <div className="grid-2">
          <div>
            <h3>Equilibrium effort</h3>
            <LineSeriesChart
              rows={rows}
              xKey="x"
              series={names.map((n, i) => ({
                key: effortKey(i),
                name: n,
                colour: seriesColour(i),
              }))}
              xLabel={paramLabel}
              yLabel="Effort"
              formatY={(v) => formatPlain(v, 2)}
              formatX={(v) => formatPlain(v, 3)}
              testId="sweep-chart"
            />
          </div>
          <div>
            <h3>Equilibrium payoff</h3>
            <LineSeriesChart
              rows={rows}
              xKey="x"
              series={names.map((n, i) => ({
                key: payoffKey(i),
                name: n,
                colour: seriesColour(i),
              }))}
              xLabel={paramLabel}
              yLabel="Payoff"
              formatY={(v) => formatPlain(v, 2)}
              formatX={(v) => formatPlain(v, 3)}
              testId="sweep-payoff-chart"
            />
          </div>
        </div>
        <p className="small" data-testid="sweep-turns" style={{ minHeight: "1.5em" }}>
          {rows.length > 0
            ? names
                .map((n, i) => {
                  const turns = turningPoints(rows.map((r) => r[effortKey(i)] as number | null));
                  return turns.length === 0
                    ? null
                    : `${n}'s effort turns at ${turns.map((k) => formatNumber(rows[k]?.x as number)).join(", ")}`;
                })
                .filter((x) => x !== null)
                .join(" · ") || "No rival's effort turns in this range."
            : ""}
        </p>
        <DataTable
          caption={`Equilibrium effort and payoff against ${paramLabel}`}
          testId="sweep-table"
          rows={rows}
          columns={[
            { key: "x", label: paramLabel, format: (v) => String(Number(v.toPrecision(8))) },
            ...names.map((n, i) => ({
              key: effortKey(i),
              label: `Effort ${n}`,
              format: (v: number) => String(Number(v.toPrecision(8))),
            })),
            ...names.map((n, i) => ({
              key: payoffKey(i),
              label: `Payoff ${n}`,
              format: (v: number) => String(Number(v.toPrecision(8))),
            })),
            {
              key: "total",
              label: "Total effort",
              format: (v) => String(Number(v.toPrecision(8))),
            },
          ]}
        />
      </section>

      <section className="card" aria-labelledby="statics-title">
        <h2 id="statics-title">Comparative statics</h2>
        <p className="small muted">
          How each rival&apos;s equilibrium effort responds to a small change in one parameter: the
          derivative, and the elasticity (percent change in effort per percent change in the
          parameter). Analytic rows use the Hillman &amp; Riley (1989) closed form; the others are
          checked numerical derivatives.
        </p>
        {statics === null ? (
          <p className="muted">
            {deferred?.leader
              ? "Shown for simultaneous moves only."
              : "Fix the highlighted fields first."}
          </p>
        ) : !statics.ok ? (
          <p className="muted" data-testid="statics-unavailable">
            {statics.message}
          </p>
        ) : (
          <FigureTable
            head={[
              textCol("Parameter"),
              numCol("At"),
              ...statics.value.names.map((n) =>
                numCol(
                  <>
                    d effort {n} <span className="muted">(elasticity)</span>
                  </>,
                  `d effort ${n}`,
                ),
              ),
              numCol("d total"),
              textCol("Method"),
            ]}
            testId="statics-table"
          >
            {statics.value.rows.map((row) => (
              <tr key={row.param}>
                <RowHeader>{row.label}</RowHeader>
                <td className="num">{formatNumber(row.at)}</td>
                {row.effort.d.map((d, i) => (
                  <td key={i} className="num" data-testid={`statics-${row.param}-effort-${i}`}>
                    {formatSigned(d)}{" "}
                    <span className="muted">
                      (
                      {row.effort.elasticity[i] === null
                        ? "\u2013"
                        : formatSigned(row.effort.elasticity[i] as number, 2)}
                      )
                    </span>
                  </td>
                ))}
                <td className="num">{formatSigned(row.totalEffort.d)}</td>
                <td>
                  <span className="badge">{row.method}</span>
                  {row.note ? <span className="small muted"> {row.note}</span> : null}
                </td>
              </tr>
            ))}
          </FigureTable>
        )}
      </section>
    </div>
  );
}
