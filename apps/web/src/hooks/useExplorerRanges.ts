"use client";

import { useMemo, useState } from "react";
import type { ReactNode } from "react";
import { createElement } from "react";
import type { Scenario } from "@contend/solver";
import type { EditorForm } from "../lib/editorForm";
import {
  buildUncertain,
  rangeFields,
  rangeKeyOf,
  rangesByPath,
  type RangeForm,
  type RangeText,
} from "../lib/rangeForm";
import { RangeToggle } from "../components/explorer/RangeToggle";

type RivalField = "cost" | "value" | "weight" | "budget";

/**
 * The explorer's ranges, stored by rival row key and read by path (see `rangeKeyOf`). Returns
 * the range scenario (or the error naming its field) and the toggles to render under the
 * contest and rival fields.
 */
export function useExplorerRanges(
  form: EditorForm,
  scenario: Scenario | null,
  initial: RangeForm | null | undefined,
) {
  const rowKeys = form.rivals.map((r) => r.key);
  const keyOf = (path: string) => rangeKeyOf(path, rowKeys);
  const [byKey, setByKey] = useState<Record<string, RangeText>>(() =>
    Object.fromEntries(Object.entries(initial ?? {}).map(([p, r]) => [keyOf(p), r])),
  );
  const rowKeyText = rowKeys.join(",");
  const ranges = useMemo<RangeForm>(
    () => rangesByPath(byKey, rowKeyText.split(",")),
    [byKey, rowKeyText],
  );
  const fields = useMemo(() => (scenario ? rangeFields(scenario) : []), [scenario]);
  const built = useMemo(
    () => (scenario ? buildUncertain(scenario, ranges) : null),
    [scenario, ranges],
  );
  const toggle = (path: string): ReactNode => {
    const field = fields.find((f) => f.path === path);
    if (!field || !scenario) return null;
    return createElement(RangeToggle, {
      field,
      value: ranges[path],
      onChange: (r: RangeText) => setByKey((all) => ({ ...all, [keyOf(path)]: r })),
      prize: scenario.prize,
      error: built && !built.ok && built.field === path ? built.message : undefined,
    });
  };
  return {
    ranges,
    built,
    fields,
    prizeToggle: (path: "prize") => toggle(path),
    rivalToggle: (i: number, f: RivalField) => toggle(`rivals.${i}.${f}`),
  };
}
