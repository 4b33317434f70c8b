/** Entry point of the bundled `contend` binary: wires the real process streams to main(). */
import { readFile } from "node:fs/promises";
import { main } from "./cli";

main(process.argv.slice(2), {
  stdout: process.stdout,
  stderr: process.stderr,
  readFile: (path) => readFile(path, "utf8"),
}).then(
  (code) => {
    process.exitCode = code;
  },
  (err: unknown) => {
    process.stderr.write(`contend: internal error: ${String(err)}\n`);
    process.exitCode = 1;
  },
);
