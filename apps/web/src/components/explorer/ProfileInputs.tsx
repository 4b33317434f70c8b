"use client";

import { useEffect, useState } from "react";
import { TextField } from "../Field";

/**
 * The two profile fields keep their own text (so "1." can be typed) and follow the profile when
 * it changes elsewhere (a click on the chart).
 */
export function ProfileInputs({
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
