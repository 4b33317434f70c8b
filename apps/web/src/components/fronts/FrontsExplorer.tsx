"use client";

import Link from "next/link";
import { useSearchParams } from "next/navigation";
import { useEffect, useMemo, useState } from "react";
import type { FrontsScenario } from "@contend/solver";
import { normalizeFronts, validateFrontsScenario } from "@contend/solver";
import type { FrontsForm } from "../../lib/frontsForm";
import { frontsFormToRaw, initialFrontsForm, scenarioToFrontsForm } from "../../lib/frontsForm";
import type { FrontsSweepSettings } from "../../lib/frontsState";
import { decodeFronts, encodeFronts, readSettings } from "../../lib/frontsState";
import { ADDRESS_SYNC_DELAY_MS } from "../../hooks/useAddressBarSync";
import { useCopyLink } from "../../hooks/useCopyLink";
import { useFrontsSolve } from "../../hooks/useFrontsWorker";
import { TextField } from "../Field";
import { AllocationChart } from "./AllocationChart";
import { FrontRivalsTable } from "./FrontRivalsTable";
import { FrontsResults } from "./FrontsResults";
import { FrontsSweep } from "./FrontsSweep";
import { FrontsTable } from "./FrontsTable";
import { StartFrontsSession } from "./StartFrontsSession";

/**
 * Several fronts, one budget: edit the fronts and the rivals' budgets and see how each rival
 * splits its money in equilibrium, where it concentrates or concedes, what one more unit of
 * budget is worth to it, and how that moves when one parameter does. The solver runs in a Web
 * Worker; the page address holds the scenario and the sweep settings.
 */
export function FrontsExplorer() {
  const params = useSearchParams();
  const initial = useMemo(() => decodeFronts(params.get("s")), [params]);
  const [form, setForm] = useState<FrontsForm>(() =>
    initial ? scenarioToFrontsForm(initial.sc) : initialFrontsForm(),
  );
  const parsed = useMemo(() => validateFrontsScenario(frontsFormToRaw(form)), [form]);
  const key = parsed.ok ? JSON.stringify(parsed.value) : "";
  // Keyed by content so that the same numbers reuse every computation.
  const scenario = useMemo<FrontsScenario | null>(
    () => (key ? (JSON.parse(key) as FrontsScenario) : null),
    [key],
  );
  const [sweep, setSweep] = useState<FrontsSweepSettings | null>(initial?.sw ?? null);
  // settings that no longer fit (a removed front's path) fall back to the defaults
  const settings = useMemo(
    () => (scenario ? readSettings(sweep, scenario) : null),
    [sweep, scenario],
  );
  useFrontsAddressBar(scenario, settings);
  const { copied, copyLink } = useCopyLink();
  const solve = useFrontsSolve(scenario);
  const shown =
    solve.status === "done" ? solve : solve.status === "solving" ? solve.previous : null;
  const solved = useMemo(
    () => (shown ? { fc: normalizeFronts(shown.scenario), eq: shown.eq } : null),
    [shown],
  );
  const currency = shown?.scenario.currency ?? null;
  return (
    <div>
      <div className="row" style={{ justifyContent: "space-between" }}>
        <h1>Several fronts, one budget</h1>
        <div className="row">
          <Link href="/explore">Single-contest explorer</Link>
          <span className="small muted">The page address holds the whole view.</span>
          <button type="button" onClick={copyLink} data-testid="copy-fronts-link">
            {copied ? "Link copied" : "Copy link"}
          </button>
        </div>
      </div>
      <p className="muted">
        Rivals fight several contests at once with one budget each (Friedman 1958 on splitting an
        advertising budget over markets). Budgets are money; a rival's spend on a front is its cost
        there times its effort.
      </p>
      <div className="row" style={{ alignItems: "flex-start", flexWrap: "wrap" }}>
        <TextField
          label="Title"
          value={form.title}
          onChange={(v) => setForm((f) => ({ ...f, title: v }))}
          testId="fronts-title"
          width="min(40rem, 100%)"
        />
        <TextField
          label="Currency"
          value={form.currency}
          hint="($, EUR…)"
          onChange={(v) => setForm((f) => ({ ...f, currency: v }))}
          testId="fronts-currency"
          width="10rem"
        />
      </div>
      <FrontsTable form={form} setForm={setForm} />
      <FrontRivalsTable form={form} setForm={setForm} />
      {!parsed.ok && (
        <p className="field-error" role="alert" data-testid="fronts-error">
          {parsed.path}: {parsed.message}
        </p>
      )}
      <p className="small muted" data-testid="fronts-status">
        <span aria-live="polite">{solve.status === "solving" ? "Solving…" : ""}</span>
        {solve.status === "done" && `Solved in ${Math.round(solve.ms)} ms in a background worker.`}
      </p>
      {solve.status === "error" && (
        <p className="field-error" role="alert">
          {solve.message}
        </p>
      )}
      {solved && <FrontsResults fc={solved.fc} eq={solved.eq} currency={currency} />}
      {solved && <AllocationChart fc={solved.fc} eq={solved.eq} currency={currency} />}
      {scenario && settings && (
        <FrontsSweep scenario={scenario} settings={settings} onSettings={setSweep} />
      )}
      {scenario && <StartFrontsSession scenario={scenario} />}
    </div>
  );
}

/** The address bar follows the last valid scenario and the sweep settings (replaceState). */
function useFrontsAddressBar(scenario: FrontsScenario | null, sw: FrontsSweepSettings | null) {
  useEffect(() => {
    if (!scenario || !sw) return;
    const t = setTimeout(() => {
      const url = `${window.location.pathname}?s=${encodeFronts({ sc: scenario, sw })}`;
      if (url !== `${window.location.pathname}${window.location.search}`)
        window.history.replaceState(null, "", url);
    }, ADDRESS_SYNC_DELAY_MS);
    return () => clearTimeout(t);
  }, [scenario, sw]);
}
