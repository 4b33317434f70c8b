import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["test/**/*.test.ts"],
    globalSetup: ["test/globalSetup.ts"],
    testTimeout: 30_000,
    hookTimeout: 60_000,
    // Each integration file starts its own server and embedded database; two at a time fits
    // the 2-core machines.
    maxWorkers: 2,
  },
});
