/**
 * Test fixtures: one real server per worker (fresh data directory, free port), pages pointed
 * at it through baseURL, and a helper that saves a named screenshot of a screen as an artifact.
 */
import { test as base, expect, type Page } from "@playwright/test";
import { mkdirSync } from "node:fs";
import path from "node:path";
import { RESULTS_DIR, ServerProcess } from "./server";

export interface Fixtures {
  /** saves test-results/screens/<name>.png and attaches it to the report */
  saveScreen: (page: Page, name: string) => Promise<void>;
}

export interface WorkerFixtures {
  server: ServerProcess;
}

export const test = base.extend<Fixtures, WorkerFixtures>({
  server: [
    // eslint-disable-next-line no-empty-pattern
    async ({}, use, workerInfo) => {
      const server = new ServerProcess({ name: `shared-w${workerInfo.workerIndex}` });
      await server.start();
      await use(server);
      await server.dispose();
    },
    { scope: "worker", timeout: 120_000 },
  ],
  baseURL: async ({ server }, use) => {
    await use(server.baseURL);
  },
  // eslint-disable-next-line no-empty-pattern
  saveScreen: async ({}, use, testInfo) => {
    const dir = path.join(RESULTS_DIR, "screens");
    mkdirSync(dir, { recursive: true });
    await use(async (page, name) => {
      const file = path.join(dir, `${name}.png`);
      await page.screenshot({ path: file, fullPage: true });
      await testInfo.attach(name, { path: file, contentType: "image/png" });
    });
  },
});

export { expect };
