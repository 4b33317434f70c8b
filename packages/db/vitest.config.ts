import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["test/**/*.test.ts"],
    globalSetup: ["test/ensureClient.ts"],
    // Each PGlite instance boots a WebAssembly PostgreSQL (about a second); the catalog test
    // also runs the Prisma CLI.
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
