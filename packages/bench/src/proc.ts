/**
 * CPU time and memory of another process, read from Linux /proc (process.cpuUsage only sees
 * the calling process). Field numbers follow proc(5): utime is field 14, stime 15, in clock
 * ticks; RSS comes from VmRSS in /proc/<pid>/status.
 */
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";

let ticksPerSecond: number | null = null;

/** sysconf(_SC_CLK_TCK); 100 on practically every Linux (common practice, no source). */
export function clockTicks(): number {
  if (ticksPerSecond === null) {
    try {
      ticksPerSecond =
        Number(execFileSync("getconf", ["CLK_TCK"], { encoding: "utf8" }).trim()) || 100;
    } catch {
      ticksPerSecond = 100;
    }
  }
  return ticksPerSecond;
}

/** Parses a /proc/<pid>/stat line; the command name (field 2) may contain spaces and parens. */
export function parseStat(line: string): { utimeTicks: number; stimeTicks: number } {
  const close = line.lastIndexOf(")");
  // fields after ")" start at field 3 (state)
  const rest = line.slice(close + 2).split(" ");
  return { utimeTicks: Number(rest[14 - 3]), stimeTicks: Number(rest[15 - 3]) };
}

/** user + system CPU seconds used so far by pid; null once the process is gone */
export function cpuSeconds(pid: number): number | null {
  try {
    const { utimeTicks, stimeTicks } = parseStat(readFileSync(`/proc/${pid}/stat`, "utf8"));
    return (utimeTicks + stimeTicks) / clockTicks();
  } catch {
    return null;
  }
}

/**
 * CPU seconds of pid's main thread alone (its task with tid = pid): the event loop that serves
 * the sockets, without the database, garbage-collector or other threads of the process.
 */
export function mainThreadCpuSeconds(pid: number): number | null {
  try {
    const { utimeTicks, stimeTicks } = parseStat(
      readFileSync(`/proc/${pid}/task/${pid}/stat`, "utf8"),
    );
    return (utimeTicks + stimeTicks) / clockTicks();
  } catch {
    return null;
  }
}

/** resident set size in MiB; null once the process is gone */
export function rssMiB(pid: number): number | null {
  try {
    const status = readFileSync(`/proc/${pid}/status`, "utf8");
    const m = /^VmRSS:\s+(\d+)\s+kB/m.exec(status);
    return m ? Number(m[1]) / 1024 : null;
  } catch {
    return null;
  }
}

/** CPU seconds of this process (user + system) */
export function selfCpuSeconds(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
}

export function loadAverage(): string {
  try {
    return readFileSync("/proc/loadavg", "utf8").split(" ").slice(0, 3).join(" ");
  } catch {
    return "n/a";
  }
}

/** pid and every process it started, recursively (a WORKERS=N primary and its workers). */
export function processTree(pid: number): number[] {
  const out = [pid];
  try {
    const children = readFileSync(`/proc/${pid}/task/${pid}/children`, "utf8").trim();
    for (const c of children ? children.split(/\s+/) : []) out.push(...processTree(Number(c)));
  } catch {
    // gone, or no children file: the process alone
  }
  return out;
}

/** CPU seconds of pid and its descendants (children that exited are not counted) */
export function treeCpuSeconds(pid: number): number | null {
  const own = cpuSeconds(pid);
  if (own === null) return null;
  return processTree(pid)
    .slice(1)
    .reduce((sum, p) => sum + (cpuSeconds(p) ?? 0), own);
}

/** resident set size of pid and its descendants in MiB */
export function treeRssMiB(pid: number): number | null {
  const own = rssMiB(pid);
  if (own === null) return null;
  return processTree(pid)
    .slice(1)
    .reduce((sum, p) => sum + (rssMiB(p) ?? 0), own);
}
