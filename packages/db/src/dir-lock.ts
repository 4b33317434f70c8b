import { closeSync, openSync, readFileSync, rmSync, writeSync } from "node:fs";

/**
 * An exclusive claim on a PGlite data directory for this process: two processes opening one
 * directory corrupt it. The lock file (beside the directory) holds the owner's pid; a lock
 * left by a process that no longer runs is taken over. Returns the release function.
 */
export function lockDataDir(dataDir: string): () => void {
  const file = `${dataDir}.lock`;
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      const fd = openSync(file, "wx");
      writeSync(fd, String(process.pid));
      closeSync(fd);
      let released = false;
      return () => {
        if (released) return;
        released = true;
        rmSync(file, { force: true });
      };
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== "EEXIST") throw error;
      const owner = Number.parseInt(readFileSync(file, "utf8"), 10);
      if (Number.isInteger(owner) && owner > 0 && isRunning(owner)) {
        throw new Error(
          `PGlite data directory ${dataDir} is in use by process ${owner}` +
            (owner === process.pid ? " (this process: close the other Database first)" : "") +
            `; only one process may open it (remove ${file} if that process is gone)`,
        );
      }
      rmSync(file, { force: true });
    }
  }
  throw new Error(`could not lock ${dataDir}`);
}

function isRunning(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === "EPERM";
  }
}
