/**
 * Child processes for the runs: the real server (node --import tsx apps/server/src/main.ts, so
 * the pid we measure and signal is the server itself, not a wrapper) and the bare baseline.
 * Every child is killed when this process exits, however it exits.
 */
import type { ChildProcess } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { HOST, SERVER_MAIN, spawnServer, waitForHttp as waitForAnswer } from "./serverProcess";
import { BENCH_OPERATOR_KEY } from "./api";

export { freePort, HOST, REPO_ROOT, SERVER_MAIN, serverNodeFlags } from "./serverProcess";

const here = path.dirname(fileURLToPath(import.meta.url));
/** The bare baseline gets the same Node flags as the real server, so both run as deployed. */
export const BARE_MAIN = path.join(here, "bareServer.ts");

const children = new Set<ChildProcess>();
const tempDirs = new Set<string>();
let hooked = false;

function hookExit() {
  if (hooked) return;
  hooked = true;
  const killAll = () => {
    for (const c of children) if (c.exitCode === null && c.signalCode === null) c.kill("SIGKILL");
    for (const d of tempDirs) rmSync(d, { recursive: true, force: true });
  };
  process.on("exit", killAll);
  for (const sig of ["SIGINT", "SIGTERM", "SIGHUP"] as const) {
    process.on(sig, () => {
      killAll();
      process.exit(130);
    });
  }
}

export function tempDir(prefix: string): string {
  hookExit();
  const dir = mkdtempSync(path.join(tmpdir(), prefix));
  tempDirs.add(dir);
  return dir;
}

export interface Child {
  proc: ChildProcess;
  pid: number;
  port: number;
  url: string;
  /** last lines of output, for error messages */
  tail(): string;
  /** output lines logged at warn or error level so far */
  problems(): { count: number; last: string[] };
  /** resolves when the process has exited */
  exited: Promise<void>;
  kill(signal?: NodeJS.Signals): Promise<void>;
}

function startChild(script: string, env: Record<string, string>, port: number): Child {
  hookExit();
  // BENCH_NODE_ARGS adds flags to the children, e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof"
  const extra = (process.env.BENCH_NODE_ARGS ?? "").split(" ").filter(Boolean);
  const proc = spawnServer({ env, script, nodeArgs: extra });
  children.add(proc);
  const lines: string[] = [];
  const problemLines: string[] = [];
  let problemCount = 0;
  const keep = (chunk: Buffer) => {
    const fresh = chunk.toString("utf8").split("\n").filter(Boolean);
    lines.push(...fresh);
    if (lines.length > 40) lines.splice(0, lines.length - 40);
    for (const line of fresh) {
      if (/\b(warn|error)\b/i.test(line)) {
        problemCount++;
        problemLines.push(line.slice(0, 300));
        if (problemLines.length > 5) problemLines.shift();
      }
    }
  };
  proc.stdout!.on("data", keep);
  proc.stderr!.on("data", keep);
  const exited = new Promise<void>((resolve) => {
    if (proc.exitCode !== null) resolve();
    proc.once("exit", () => {
      children.delete(proc);
      resolve();
    });
  });
  return {
    proc,
    pid: proc.pid!,
    port,
    url: `http://${HOST}:${port}`,
    tail: () => lines.join("\n"),
    problems: () => ({ count: problemCount, last: [...problemLines] }),
    exited,
    async kill(signal = "SIGTERM") {
      if (proc.exitCode === null && proc.signalCode === null) proc.kill(signal);
      const timer = setTimeout(() => proc.kill("SIGKILL"), 15_000);
      await exited;
      clearTimeout(timer);
    },
  };
}

/** Polls GET url until it answers 200; bounded by timeoutMs. */
export async function waitForHttp(url: string, child: Child, timeoutMs = 60_000): Promise<void> {
  await waitForAnswer(url, child.proc, { timeoutMs, tail: child.tail });
}

/** Which database the real server gets: what the reports print. */
export function benchDatabase(): string {
  return process.env.BENCH_DATABASE_URL || "embedded PGlite";
}

export interface ServerOptions {
  dataDir: string;
  port: number;
  /** extra environment, e.g. rate limits */
  env?: Record<string, string>;
}

/**
 * The real server: API and sockets only (WEB=off), no demo session, embedded PGlite in dataDir;
 * or PostgreSQL when BENCH_DATABASE_URL names an empty database (the server migrates it).
 */
/** Per-address limits far above anything a benchmark sends from loopback. */
export const UNLIMITED_ADDRESS = {
  LIMIT_CONNECTIONS_PER_IP: "1000000",
  LIMIT_CONNECTS_PER_IP_PER_MINUTE: "1000000",
  LIMIT_MESSAGES_PER_IP_PER_SECOND: "1000000",
  LIMIT_AUTH_FAILURES_PER_IP_PER_MINUTE: "1000000",
  LIMIT_SESSIONS_PER_IP_PER_HOUR: "1000000",
} as const;

export async function startServer(opts: ServerOptions): Promise<Child> {
  const child = startChild(
    SERVER_MAIN,
    {
      WEB: "off",
      DEMO: "off",
      HOST,
      PORT: String(opts.port),
      CONTEND_DATA_DIR: opts.dataDir,
      DATABASE_URL: benchDatabase() === "embedded PGlite" ? "" : benchDatabase(),
      LOG_LEVEL: "warn",
      CONTEND_OPERATOR_KEY: BENCH_OPERATOR_KEY,
      // Every simulated client comes from this one address: lift the per-address limits
      // (they are measured by the server tests, not here).
      ...UNLIMITED_ADDRESS,
      ...opts.env,
    },
    opts.port,
  );
  await waitForHttp(`${child.url}/api/health`, child);
  return child;
}

export async function startBareServer(
  port: number,
  opts: { seats: number; viewBytes: number; progressMs: number; durableUrl?: string },
): Promise<Child> {
  const env = {
    DURABLE_URL: opts.durableUrl ?? "",
    PORT: String(port),
    HOST,
    SEATS: String(opts.seats),
    VIEW_BYTES: String(opts.viewBytes),
    PROGRESS_MS: String(opts.progressMs),
  };
  const child = startChild(BARE_MAIN, env, port);
  await waitForHttp(`${child.url}/health`, child);
  return child;
}
