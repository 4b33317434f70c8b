/**
 * Fault runs against the real server; each prints what it tried and what survived.
 *   npx tsx src/faults.ts [--only crash,duplicates,slow,fuzz] [--fuzz 10000] [--json]
 * 1. crash: SIGKILL while seats are sealing, restart on the same data directory, reconnect.
 * 2. duplicates and out-of-order commands.
 * 3. slow clients that stop reading their socket.
 * 4. fuzzed messages; the event log must be unchanged except for legit events.
 * Asserts nothing; reports pass/fail per check.
 */
import { fileURLToPath } from "node:url";
import type { Child } from "./child";
import { flag, hasFlag, intFlag } from "./flags";
import { markdownTable } from "./table";
import { check } from "./faults/common";
import type { FaultReport } from "./faults/common";
import { crashRun } from "./faults/crash";
import { duplicatesRun } from "./faults/duplicates";
import { fuzzRun } from "./faults/fuzz";
import { slowRun } from "./faults/slow";

export type { Check, FaultReport } from "./faults/common";
export { crashRun, duplicatesRun, fuzzRun, slowRun };

export function formatFault(r: FaultReport): string {
  const pass = r.checks.filter((c) => c.pass).length;
  return [
    `Fault: ${r.name} - ${pass}/${r.checks.length} checks pass`,
    `Tried: ${r.tried}`,
    "",
    markdownTable(
      ["figure", "value"],
      r.figures.map(([k, v]) => [k, v]),
    ),
    "",
    markdownTable(
      ["check", "expected", "got", "result"],
      r.checks.map((c) => [c.check, c.expected, c.got, c.pass ? "pass" : "FAIL"]),
    ),
  ].join("\n");
}

export async function runFaults(
  argv: readonly string[],
  log = console.error,
): Promise<FaultReport[]> {
  const only = (flag(argv, "only") ?? "crash,duplicates,slow,fuzz").split(",");
  const out: FaultReport[] = [];
  const run = async (name: string, fn: () => Promise<FaultReport>) => {
    if (!only.includes(name)) return;
    log(`faults: ${name}`);
    try {
      out.push(await fn());
    } catch (error) {
      out.push({
        name,
        tried: "the run itself failed",
        figures: [],
        checks: [
          check(
            "run completed",
            "no error",
            String(error instanceof Error ? error.message : error).slice(0, 300),
            false,
          ),
        ],
      });
    }
  };
  await run("crash", () =>
    crashRun({ sessions: intFlag(argv, "crash-sessions", 10, 1), seats: 8 }),
  );
  await run("duplicates", () => duplicatesRun());
  await run("slow", () => slowRun({ slow: intFlag(argv, "slow", 50, 1), rounds: 10 }));
  await run("fuzz", () =>
    fuzzRun({
      messages: intFlag(argv, "fuzz", 10_000, 1),
      connections: 60,
      seed: intFlag(argv, "seed", 7, 0),
    }),
  );
  return out;
}

async function main() {
  const argv = process.argv.slice(2);
  const reports = await runFaults(argv);
  if (hasFlag(argv, "json")) console.log(JSON.stringify(reports, null, 2));
  else console.log(reports.map(formatFault).join("\n\n"));
  process.exit(0);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  main().catch((error: unknown) => {
    console.error(error);
    process.exit(1);
  });
}

export type { Child };
