import { linkSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";

/**
 * An exclusive claim on a PGlite data directory for this process: two processes opening one
 * directory corrupt it. The lock file (beside the directory) names its owner by pid AND by the
 * process's start time, so that a dead owner whose pid now belongs to another process (often
 * pid 1 after a container restart) is recognised as gone. The file appears whole (written
 * aside, then hard-linked into place), so a reader never sees a half-written lock; a lock file
 * without an owner line is still being written and is not stale unless it is older than
 * LOCK_WRITE_GRACE_MS. Returns the release function.
 *
 * Format: one line "PID START", START being the process start time as the kernel reports it
 * (Linux: field 22 of /proc/PID/stat, clock ticks since boot) or "-" where the platform does not
 * tell; then only the pid is compared. A bare "PID" (written by earlier versions) reads the same.
 */
export function lockDataDir(dataDir: string): () => void {
  const file = `${dataDir}.lock`;
  const me: LockOwner = { pid: process.pid, start: processStart(process.pid) };
  const mine = formatOwner(me);
  for (let attempt = 0; attempt < 2; attempt++) {
    if (tryCreate(file, mine)) {
      let released = false;
      return () => {
        if (released) return;
        released = true;
        // only our own lock: a stale takeover by another process must not be undone
        if (readText(file) === mine) rmSync(file, { force: true });
      };
    }
    const text = readText(file);
    if (text === null) continue; // removed meanwhile: try again
    const state = lockState(text, ageMs(file));
    if (state.held) {
      const owner = state.owner;
      throw new Error(
        `PGlite data directory ${dataDir} is in use by ${
          owner ? `process ${owner.pid}` : "a process still writing its lock"
        }` +
          (owner?.pid === process.pid ? " (this process: close the other Database first)" : "") +
          `; only one process may open it (remove ${file} if that process is gone)`,
      );
    }
    // stale: remove it unless another process replaced it since we read it
    if (readText(file) === text) rmSync(file, { force: true });
  }
  throw new Error(`could not lock ${dataDir}`);
}

/** How long a lock file may exist without an owner line before it counts as abandoned. */
export const LOCK_WRITE_GRACE_MS = 10_000;

export interface LockOwner {
  pid: number;
  /** process start time as the kernel reports it, null when the platform does not tell */
  start: string | null;
}

/** Whether a lock file with this text and age belongs to a live process, and to whom. */
export function lockState(
  text: string,
  ageMs: number,
  startOf: (pid: number) => string | null = processStart,
  running: (pid: number) => boolean = isRunning,
): { held: boolean; owner: LockOwner | null } {
  const owner = parseOwner(text);
  if (owner === null) return { held: ageMs < LOCK_WRITE_GRACE_MS, owner: null };
  if (!running(owner.pid)) return { held: false, owner };
  if (owner.start !== null) {
    const now = startOf(owner.pid);
    // the pid runs, but it is a different process than the one that took the lock
    if (now !== null && now !== owner.start) return { held: false, owner };
  }
  return { held: true, owner };
}

function formatOwner(o: LockOwner): string {
  return `${o.pid} ${o.start ?? "-"}\n`;
}

function parseOwner(text: string): LockOwner | null {
  const m = /^\s*(\d+)(?:[ \t]+(\S+))?\s*$/.exec(text);
  if (!m) return null;
  const pid = Number(m[1]);
  if (!Number.isSafeInteger(pid) || pid <= 0) return null;
  const start = m[2] === undefined || m[2] === "-" ? null : m[2];
  return { pid, start };
}

/** Creates the lock file with its whole content at once; false when it already exists. */
function tryCreate(file: string, content: string): boolean {
  const aside = `${file}.${process.pid}.${Date.now()}.tmp`;
  writeFileSync(aside, content, { flag: "wx" });
  try {
    linkSync(aside, file);
    return true;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === "EEXIST") return false;
    throw error;
  } finally {
    rmSync(aside, { force: true });
  }
}

function readText(file: string): string | null {
  try {
    return readFileSync(file, "utf8");
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === "ENOENT") return null;
    throw error;
  }
}

function ageMs(file: string): number {
  try {
    return Date.now() - statSync(file).mtimeMs;
  } catch {
    return Number.POSITIVE_INFINITY;
  }
}

/** Linux: start time of a process (clock ticks since boot), null elsewhere or when it is gone. */
export function processStart(pid: number): string | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    // the command name (field 2) may hold spaces and parentheses: count from its closing one
    const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    const start = fields[19]; // field 22 of proc(5); fields[0] is field 3
    return start && /^\d+$/.test(start) ? start : null;
  } catch {
    return null;
  }
}

function isRunning(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === "EPERM";
  }
}
