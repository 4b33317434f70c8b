// `npm test -w @contend/db` on a fresh clone runs before any build; generate the Prisma
// client once if it is missing (turbo normally runs the build first).
import { execFileSync } from "node:child_process";
import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";

export default function setup() {
  const packageDir = fileURLToPath(new URL("..", import.meta.url));
  if (existsSync(`${packageDir}/src/generated/prisma/client.ts`)) return;
  execFileSync(`${packageDir}/../../node_modules/.bin/prisma`, ["generate"], {
    cwd: packageDir,
    stdio: "inherit",
  });
}
