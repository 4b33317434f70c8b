// Writes prisma/migrations/<UTC stamp>_<name>/migration.sql: the SQL that takes the schema as
// last committed (git HEAD, or --from <file>) to prisma/schema.prisma as it is now.
// Usage: npm run migration:new -w @contend/db -- <name> [--from <old schema.prisma>]
// Schema-only `prisma migrate diff` works offline; `--from-migrations` does not (PGlite shadow
// database rejects multi-statement scripts, P3006), hence the old schema file as the source.
import { execFileSync } from "node:child_process";
import { mkdirSync, mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";

const root = path.join(import.meta.dirname, "..", "..", "..");
const schema = path.join(root, "prisma", "schema.prisma");
const args = process.argv.slice(2);
const name = args.find((a, i) => !a.startsWith("--") && args[i - 1] !== "--from");
if (!name || !/^[a-z0-9_]+$/.test(name)) {
  console.error("usage: new-migration <name: lowercase letters, digits, _> [--from <schema>]");
  process.exit(2);
}

const fromIndex = args.indexOf("--from");
let from = fromIndex >= 0 ? args[fromIndex + 1] : undefined;
if (!from) {
  const previous = execFileSync("git", ["show", "HEAD:prisma/schema.prisma"], {
    cwd: root,
    encoding: "utf8",
  });
  from = path.join(mkdtempSync(path.join(tmpdir(), "contend-schema-")), "schema.prisma");
  writeFileSync(from, previous);
}

const sql = execFileSync(
  path.join(root, "node_modules", ".bin", "prisma"),
  ["migrate", "diff", "--from-schema-datamodel", from, "--to-schema-datamodel", schema, "--script"],
  { cwd: path.join(root, "packages", "db"), encoding: "utf8" },
);
if (!/^\s*(CREATE|ALTER|DROP)/m.test(sql)) {
  console.error("schema.prisma has no changes against the old schema; nothing written");
  process.exit(1);
}
const stamp = new Date().toISOString().replace(/\D/g, "").slice(0, 14);
const dir = path.join(root, "prisma", "migrations", `${stamp}_${name}`);
mkdirSync(dir, { recursive: true });
writeFileSync(path.join(dir, "migration.sql"), sql);
console.log(`wrote ${path.relative(root, dir)}/migration.sql`);
