"use client";

import Link from "next/link";
import { useDeferredValue, useMemo, useState } from "react";
import type { FrontsScenario } from "@contend/solver";
import { normalizeFronts, solveFronts, validateFrontsScenario } from "@contend/solver";
import type { FrontsForm } from "../../lib/frontsForm";
import { frontsFormToRaw, initialFrontsForm } from "../../lib/frontsForm";
import { TextField } from "../Field";
import { AllocationChart } from "./AllocationChart";
import { FrontRivalsTable } from "./FrontRivalsTable";
import { FrontsResults } from "./FrontsResults";
import { FrontsSweep } from "./FrontsSweep";
import { FrontsTable } from "./FrontsTable";

/**
 * Several fronts, one budget: edit the fronts and the rivals' budgets and see how each rival
 * splits its money in equilibrium, where it concentrates or concedes, what one more unit of
 * budget is worth to it, and how that moves when one parameter does. Runs in the browser.
 */
export function FrontsExplorer() {
  const [form, setForm] = useState<FrontsForm>(initialFrontsForm);
  const parsed = useMemo(() => validateFrontsScenario(frontsFormToRaw(form)), [form]);
  const key = parsed.ok ? JSON.stringify(parsed.value) : "";
  // Keyed by content so that the same numbers reuse every computation.
  const scenario = useMemo<FrontsScenario | null>(
    () => (key ? (JSON.parse(key) as FrontsScenario) : null),
    [key],
  );
  const deferred = useDeferredValue(scenario);
  const solved = useMemo(() => {
    if (!deferred) return null;
    const fc = normalizeFronts(deferred);
    return { fc, eq: solveFronts(fc).equilibrium };
  }, [deferred]);
  const currency = deferred?.currency ?? null;
  return (
    <div>
      <div className="row" style={{ justifyContent: "space-between" }}>
        <h1>Several fronts, one budget</h1>
        <Link href="/explore">Single-contest explorer</Link>
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
      {solved && <FrontsResults fc={solved.fc} eq={solved.eq} currency={currency} />}
      {solved && <AllocationChart fc={solved.fc} eq={solved.eq} currency={currency} />}
      {deferred && <FrontsSweep scenario={deferred} />}
    </div>
  );
}
