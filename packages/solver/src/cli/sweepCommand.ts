import type { InputError, Parsed, Scenario } from "../types";
import { sweep1d, type Sweep1d } from "../sweep/sweep1d";
import type { ParsedArgs } from "./args";
import { parseNumber } from "./args";
import { csvLine } from "./format";

const FLAG_OF: Record<string, string> = {
  "sweep.param": "--param",
  "sweep.from": "--from",
  "sweep.to": "--to",
  "sweep.steps": "--steps",
};

export function sweepCsv(sw: Sweep1d): string {
  const header: string[] = [sw.param];
  for (const name of sw.names) header.push(`spend:${name}`, `effort:${name}`, `payoff:${name}`);
  header.push("totalSpend", "totalEffort", "dissipation", "kind");
  const lines = [csvLine(header)];
  sw.values.forEach((v, k) => {
    const row: (number | null | string)[] = [v];
    sw.names.forEach((_, i) =>
      row.push(sw.spends[i]![k] ?? null, sw.efforts[i]![k] ?? null, sw.payoffs[i]![k] ?? null),
    );
    row.push(
      sw.totalSpend[k] ?? null,
      sw.totalEffort[k] ?? null,
      sw.dissipation[k] ?? null,
      sw.kinds[k]!,
    );
    lines.push(csvLine(row));
  });
  return `${lines.join("\n")}\n`;
}

export function runSweep(s: Scenario, args: ParsedArgs, json: boolean): Parsed<string> {
  const need = (flag: string): Parsed<string> => {
    const v = args.flags.get(flag);
    return v === undefined
      ? { ok: false, path: `--${flag}`, message: "is required for sweep" }
      : { ok: true, value: v };
  };
  const param = need("param");
  if (!param.ok) return param;
  const nums: number[] = [];
  for (const flag of ["from", "to", "steps"]) {
    const raw = need(flag);
    if (!raw.ok) return raw;
    const x = parseNumber(raw.value);
    if (x === null)
      return {
        ok: false,
        path: `--${flag}`,
        message: `must be a finite number (got "${raw.value}")`,
      };
    nums.push(x);
  }
  const [from, to, steps] = nums as [number, number, number];
  const sw = sweep1d(s, { param: param.value, from, to, steps });
  if (!sw.ok) {
    const err: InputError = { ...sw, path: FLAG_OF[sw.path] ?? sw.path };
    return err;
  }
  return { ok: true, value: json ? `${JSON.stringify(sw.value)}\n` : sweepCsv(sw.value) };
}
