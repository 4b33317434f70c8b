import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    // Property tests explore new random cases on every local run; CI replays a fixed seed so a
    // rare case found by chance shows up here first, not as a flaky submission.
    setupFiles: ["./test/setupFastCheck.ts"],
  },
});
