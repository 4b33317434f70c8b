import path from "node:path";

export type DatabaseTarget =
  | { kind: "pglite"; dataDir: string }
  | { kind: "pglite"; dataDir: null } // in memory
  | { kind: "postgres"; url: string };

export const DEFAULT_PGLITE_DIR = "./data/pglite";

/**
 * Where a url points:
 *   undefined or ""                    -> embedded PGlite in ./data/pglite (relative to the cwd)
 *   "memory://"                        -> embedded PGlite in memory (tests)
 *   "pglite:<dir>" or a directory path -> embedded PGlite in that directory
 *   "postgres://..." "postgresql://..." -> a PostgreSQL server
 */
export function resolveTarget(url: string | undefined): DatabaseTarget {
  const value = url?.trim() ?? "";
  if (value === "") return { kind: "pglite", dataDir: path.resolve(DEFAULT_PGLITE_DIR) };
  if (value === "memory://" || value === "pglite:memory://")
    return { kind: "pglite", dataDir: null };
  if (/^postgres(ql)?:\/\//i.test(value)) return { kind: "postgres", url: value };
  if (value.startsWith("pglite:")) {
    const dir = value.slice("pglite:".length);
    if (dir === "") throw new Error('"pglite:" needs a directory, e.g. pglite:./data/pglite');
    return { kind: "pglite", dataDir: path.resolve(dir) };
  }
  const scheme = /^([a-z][a-z0-9+.-]*):\/\//i.exec(value);
  if (scheme) {
    throw new Error(
      `unsupported database url scheme "${scheme[1]}:" (use postgres://, pglite:<dir>, a directory or memory://)`,
    );
  }
  return { kind: "pglite", dataDir: path.resolve(value) };
}
