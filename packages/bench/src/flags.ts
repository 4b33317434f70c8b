/** Tiny flag reader: --name value, --name=value, or a bare --switch. */
export function flag(argv: readonly string[], name: string): string | null {
  const i = argv.findIndex((a) => a === `--${name}` || a.startsWith(`--${name}=`));
  if (i < 0) return null;
  const a = argv[i]!;
  if (a.includes("=")) return a.slice(a.indexOf("=") + 1);
  const next = argv[i + 1];
  return next !== undefined && !next.startsWith("--") ? next : "";
}

export function intFlag(argv: readonly string[], name: string, fallback: number, min = 0): number {
  const v = flag(argv, name);
  if (v === null || v === "") return fallback;
  const n = Number(v);
  if (!Number.isInteger(n) || n < min) throw new Error(`--${name} must be an integer >= ${min}`);
  return n;
}

export function hasFlag(argv: readonly string[], name: string): boolean {
  return flag(argv, name) !== null;
}
