/**
 * Child processes for the runs: the real server (node --import tsx apps/server/src/main.ts, so
 * the pid we measure and signal is the server itself, not a wrapper) and the bare baseline.
 * Every child is killed when this process exits, however it exits.
 */
import { spawn } from "node:child_process";
import type { ChildProcess } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";

const here = path.dirname(fileURLToPath(import.meta.url));
export const REPO_ROOT = path.resolve(here, "../../..");
export const SERVER_MAIN = path.join(REPO_ROOT, "apps/server/src/main.ts");

/**
 * The Node flags `npm start` gives the server (apps/server/package.json, config.nodeOptions),
 * given here to both the real server and the bare baseline, so both run as deployed.
 */
export function serverNodeFlags(): string[] {
  const pkg = JSON.parse(
    readFileSync(path.join(REPO_ROOT, "apps/server/package.json"), "utf8"),
  ) as { config?: { nodeOptions?: string } };
  return (pkg.config?.nodeOptions ?? "").split(" ").filter(Boolean);
}
export const BARE_MAIN = path.join(here, "bare-server.ts");
export const HOST = "127.0.0.1";

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

/** A port that was free a moment ago on 127.0.0.1 (the OS picks it). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once("error", reject);
    srv.listen(0, HOST, () => {
      const address = srv.address();
      const port = typeof address === "object" && address ? address.port : 0;
      srv.close(() => resolve(port));
    });
  });
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
  const proc = spawn(
    process.execPath,
    [...serverNodeFlags(), ...extra, "--import", "tsx", script],
    {
      cwd: REPO_ROOT,
      env: { ...process.env, ...env },
      stdio: ["ignore", "pipe", "pipe"],
    },
  );
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

/** Polls GET path until it answers 200; bounded by timeoutMs. */
export async function waitForHttp(url: string, child: Child, timeoutMs = 60_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (child.proc.exitCode !== null || child.proc.signalCode !== null) {
      throw new Error(`child exited before answering ${url}:\n${child.tail()}`);
    }
    try {
      const res = await fetch(url, { signal: AbortSignal.timeout(2000) });
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no answer from ${url} within ${timeoutMs} ms:\n${child.tail()}`);
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
      ...opts.env,
    },
    opts.port,
  );
  await waitForHttp(`${child.url}/api/health`, child);
  return child;
}

export async function startBareServer(
  port: number,
  opts: { seats: number; viewBytes: number; progressMs: number },
): Promise<Child> {
  const env = {
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
