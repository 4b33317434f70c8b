/** Minimal flag parser: `--name value`, `--name=value`, boolean flags, positionals. */
import type { InputError, Parsed } from "../types";

export interface ParsedArgs {
  positionals: string[];
  flags: Map<string, string>;
  booleans: Set<string>;
}

export function parseArgs(
  argv: readonly string[],
  valued: readonly string[],
  booleans: readonly string[],
): Parsed<ParsedArgs> {
  const out: ParsedArgs = { positionals: [], flags: new Map(), booleans: new Set() };
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (arg === "-h") {
      out.booleans.add("help");
      continue;
    }
    if (!arg.startsWith("--") || arg === "--") {
      out.positionals.push(arg);
      continue;
    }
    const eq = arg.indexOf("=");
    const name = arg.slice(2, eq >= 0 ? eq : undefined);
    if (booleans.includes(name)) {
      if (eq >= 0) return fail(`--${name}`, "takes no value");
      out.booleans.add(name);
      continue;
    }
    if (!valued.includes(name)) {
      const known = [...valued, ...booleans].map((f) => `--${f}`).join(", ");
      return fail(`--${name}`, `unknown option (this command accepts ${known || "no options"})`);
    }
    let value: string | undefined;
    if (eq >= 0) value = arg.slice(eq + 1);
    else {
      value = argv[i + 1];
      i++;
    }
    if (value === undefined || value === "") return fail(`--${name}`, "needs a value");
    if (out.flags.has(name)) return fail(`--${name}`, "given more than once");
    out.flags.set(name, value);
  }
  return { ok: true, value: out };
}

function fail(path: string, message: string): InputError {
  return { ok: false, path, message };
}

/** A finite number written plainly: digits, optional sign, decimals, exponent. */
export function parseNumber(text: string): number | null {
  const t = text.trim();
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(t)) return null;
  const x = Number(t);
  return Number.isFinite(x) ? x : null;
}
