/**
 * Runs the `contend` command line in-process, as the CLI tests do: `main` with an injected io
 * that collects stdout and stderr and reads the named in-memory files before the disk.
 */
import { readFile } from "node:fs/promises";
import { main, type CliIo } from "../src/cli/cli";

export interface CliRun {
  code: number;
  stdout: string;
  stderr: string;
}

/**
 * A runner over in-memory files (name -> text). Any other path is read from disk, or, with
 * `disk: false`, fails as a missing file does.
 */
export function cliRunner(files: Record<string, string> = {}, opts: { disk?: boolean } = {}) {
  const disk = opts.disk ?? true;
  return async (...argv: string[]): Promise<CliRun> => {
    let stdout = "";
    let stderr = "";
    const io: CliIo = {
      stdout: { write: (s: string) => (stdout += s) },
      stderr: { write: (s: string) => (stderr += s) },
      readFile: async (path: string) => {
        if (path in files) return files[path]!;
        if (disk) return readFile(path, "utf8");
        throw Object.assign(new Error(`no such file: ${path}`), { code: "ENOENT" });
      },
    };
    const code = await main(argv, io);
    return { code, stdout, stderr };
  };
}
