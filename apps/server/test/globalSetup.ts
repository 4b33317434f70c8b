/**
 * Migrating a fresh embedded database takes seconds on these machines, so one migrated
 * template is made once and each test copies it (a closed PGlite directory is plain files).
 */
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { openDatabase } from "@contend/db";
import type { TestProject } from "vitest/node";

export default async function setup(project: TestProject) {
  const root = mkdtempSync(path.join(os.tmpdir(), "contend-server-template-"));
  const dir = path.join(root, "pglite");
  const db = await openDatabase({ url: dir });
  await db.close();
  project.provide("templateDir", dir);
  return () => rmSync(root, { recursive: true, force: true });
}

declare module "vitest" {
  export interface ProvidedContext {
    templateDir: string;
  }
}
