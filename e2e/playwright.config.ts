import { defineConfig, devices } from "@playwright/test";

/**
 * Browser journeys against the real server (HTTP + socket.io + the built web app) on a free
 * port with a fresh embedded database. The server is started by the fixture in
 * support/fixtures.ts, not by `webServer`, because the resilience journey must kill and
 * restart it on the same data directory.
 */
export default defineConfig({
  testDir: "./specs",
  outputDir: "./test-results/artifacts",
  // 2-core machine: one browser process at a time keeps timings honest.
  workers: 1,
  fullyParallel: false,
  retries: 0,
  forbidOnly: !!process.env.CI,
  timeout: 120_000,
  expect: { timeout: 15_000 },
  reporter: [["list"], ["html", { outputFolder: "./playwright-report", open: "never" }]],
  use: {
    headless: true,
    screenshot: "only-on-failure",
    trace: "retain-on-failure",
    actionTimeout: 15_000,
    navigationTimeout: 30_000,
  },
  projects: [
    {
      name: "chromium",
      use: {
        ...devices["Desktop Chrome"],
        // Debian's chromium matches Playwright 1.64's bundled revision; never download browsers.
        launchOptions: {
          executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
          args: [
            "--no-sandbox",
            "--disable-gpu",
            "--disable-background-networking",
            "--disable-component-update",
            "--disable-sync",
            "--disable-quic",
            "--no-first-run",
          ],
        },
      },
    },
  ],
});
