"use client";

import type { EditorForm } from "../../lib/editorForm";
import { SelectField } from "../Field";
import { Term } from "../Glossary";

/** Who moves first: simultaneous moves, or one named rival commits and the others follow. */
export function TimingFields({
  form,
  leader,
  setLeader,
  error,
}: {
  form: EditorForm;
  leader: string;
  setLeader: (leader: string) => void;
  error: string | undefined;
}) {
  return (
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
        error={error}
        testId="field-leader"
      />
      <p className="small muted">
        With a leader, the others see its spend and each picks its{" "}
        <Term id="best-reply">best reply</Term>; the leader chooses knowing that.
      </p>
    </fieldset>
  );
}
