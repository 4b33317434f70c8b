/**
 * Every benchmark of this package in one run: database appends alone, the load run (real server and bare socket.io
 * baseline), then the fault runs, then one table of targets and checks. Prints numbers and
 * pass/fail; asserts nothing and exits 0 even on misses.
 *   npx tsx src/runAll.ts [--full] [load flags, see load.ts] [fault flags, see faults.ts]
 */
import os from "node:os";
import { formatDbAppend, runDbAppend } from "./dbAppend";
import { formatFault, runFaults } from "./faults";
import { configFrom, formatLoad, runLoad } from "./load";
import { loadAverage } from "./proc";
import { markdownTable } from "./table";
import type { Cell } from "./table";

async function main() {
  const argv = process.argv.slice(2);
  const started = new Date();
  console.log(
    `Machine: ${os.cpus().length} cores (${os.cpus()[0]?.model ?? "unknown"}), ` +
      `${(os.totalmem() / 2 ** 30).toFixed(1)} GiB memory, Node ${process.version}, ` +
      `${started.toISOString()}, load average ${loadAverage()}`,
  );
  console.log(
    "Clients run in this process, each server in a child process, on the same machine.\n",
  );

  console.error("db: event-log appends on PGlite");
  const appends = await runDbAppend({ appends: 400, sessions: 40 });
  console.log(`${formatDbAppend(appends)}\n`);

  const load = await runLoad(configFrom(argv));
  console.log(formatLoad(load));
  console.log("");
  const faults = await runFaults(argv);
  for (const f of faults) console.log(`${formatFault(f)}\n`);

  const rows: Cell[][] = [
    ...load.targets.map((t) => [
      "load",
      t.target,
      t.measured,
      t.pass === null ? "not tested at this size" : t.pass ? "pass" : "MISS",
    ]),
    ...faults.map((f) => {
      const failed = f.checks.filter((c) => !c.pass);
      return [
        "faults",
        f.name,
        `${f.checks.length - failed.length}/${f.checks.length} checks`,
        failed.length === 0 ? "pass" : `FAIL: ${failed.map((c) => c.check).join("; ")}`,
      ];
    }),
  ];
  console.log("Summary");
  console.log(markdownTable(["run", "target or fault", "measured", "result"], rows));
  console.log(
    `\nFinished ${new Date().toISOString()} (${((Date.now() - started.getTime()) / 1000).toFixed(0)} s), load average ${loadAverage()}`,
  );
  process.exit(0);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
