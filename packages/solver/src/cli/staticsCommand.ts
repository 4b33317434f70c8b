import { comparativeStatics } from "../statics/comparativeStatics";
import type { Parsed, Scenario } from "../types";
import { CAUTIONS, fmt, table } from "./format";

export function runStatics(s: Scenario, json: boolean): Parsed<string> {
  const res = comparativeStatics(s);
  if (!res.ok) return res;
  if (json) return { ok: true, value: `${JSON.stringify(res.value)}\n` };
  const { names, rows } = res.value;
  const header = ["Parameter", "Method", ...names.map((n) => `d effort ${n}`), "d total"];
  const body = rows.map((r) => [
    `${r.label} (${r.param} = ${fmt(r.at)})`,
    r.method,
    ...r.effort.d.map(fmt),
    fmt(r.totalEffort.d),
  ]);
  const eHeader = ["Parameter", ...names.map((n) => `elasticity ${n}`)];
  const eBody = rows.map((r) => [r.param, ...r.effort.elasticity.map((x) => fmt(x))]);
  const text = [
    `${s.title}: comparative statics of equilibrium efforts`,
    "",
    table(header, body),
    "",
    table(eHeader, eBody),
    "",
    CAUTIONS,
  ].join("\n");
  return { ok: true, value: `${text}\n` };
}
