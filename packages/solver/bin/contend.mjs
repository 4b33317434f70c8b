#!/usr/bin/env node
/**
 * The `contend` command as npm links it (package.json "bin", so `npx contend` works straight
 * after `npm ci`): runs the CLI's TypeScript source through tsx, with no build step and never a
 * stale bundle. `npm run build -w @contend/solver` makes the single-file bundle
 * (dist/contend.mjs) for machines without the repository.
 */
import { tsImport } from "tsx/esm/api";

await tsImport("../src/cli/main.ts", import.meta.url);
