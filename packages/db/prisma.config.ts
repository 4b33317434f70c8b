// Prisma CLI settings for this repository. The machines that build Contend cannot download
// Prisma's native engines, so the CLI runs its WebAssembly schema engine ("js") with an
// in-memory PGlite adapter. Only schema-only commands are used: `prisma generate` and
// `prisma migrate diff --from-empty|--from-schema-datamodel ... --to-schema-datamodel ... --script`.
import path from "node:path";
import { PGlite } from "@electric-sql/pglite";
import type { PrismaPg } from "@prisma/adapter-pg";
import { PrismaPGlite } from "pglite-prisma-adapter";
import { defineConfig } from "prisma/config";

const root = path.join(import.meta.dirname, "..", "..");

export default defineConfig({
  experimental: { adapter: true },
  engine: "js",
  schema: path.join(root, "prisma", "schema.prisma"),
  migrations: { path: path.join(root, "prisma", "migrations") },
  // The adapter is typed against an older @prisma/driver-adapter-utils (see src/open.ts).
  async adapter() {
    return new PrismaPGlite(new PGlite()) as unknown as PrismaPg;
  },
});
