"use client";

import { useMemo, useState } from "react";
import { validateScenario } from "@contend/solver";
import type { Scenario } from "@contend/solver";
import { formToContestRaw } from "../lib/editorForm";
import { scenarioToForm } from "../lib/editorImport";
import { contestErrors } from "../lib/formErrors";
import type { EditorForm } from "../lib/editorForm";

function formOf(s: Scenario): EditorForm {
  return scenarioToForm({ ...s, session: {} });
}

/** The form's scenario with the leader choice, or null while a field is invalid. */
function scenarioOf(form: EditorForm, leader: string): Scenario | null {
  const raw = { ...formToContestRaw(form), leader: leader === "" ? null : leader };
  const r = validateScenario(raw);
  return r.ok ? r.value : null;
}

/**
 * The explorer's editable scenario: the contest form, the leader choice ("" for simultaneous
 * moves), the field errors, and the valid scenario (null while a field is invalid).
 */
export function useExplorerScenario(initial: Scenario) {
  const [form, setForm] = useState<EditorForm>(() => formOf(initial));
  const [leader, setLeader] = useState<string>(initial.leader ?? "");

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
  return { form, setForm, leader, setLeader, errors, scenario };
}
