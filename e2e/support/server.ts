/**
 * Runs the real Contend server (apps/server) as a child process on a free port with its own
 * embedded database directory, and can kill and restart it on the same port and data
 * directory so a test can prove that acknowledged events survive a restart.
 */
import type { ChildProcess } from "node:child_process";
import {
  createWriteStream,
  mkdirSync,
  mkdtempSync,
  readFileSync,
  rmSync,
  type WriteStream,
} from "node:fs";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { E2E_OPERATOR_KEY } from "./api";
import { freePort, spawnServer, waitForHttp } from "@contend/bench/serverProcess";

export { freePort, REPO_ROOT, SERVER_DIR } from "@contend/bench/serverProcess";

const here = path.dirname(fileURLToPath(import.meta.url));
export const RESULTS_DIR = path.resolve(here, "../test-results");

export interface ServerOptions {
  /** short label used in the data directory and log file names */
  name: string;
  /** extra environment variables for the server */
  env?: Record<string, string>;
  /** how long to wait for GET /api/health (ms) */
  startTimeoutMs?: number;
}

export class ServerProcess {
  readonly name: string;
  readonly dataDir: string;
  readonly logPath: string;
  port = 0;
  starts = 0;
  private child: ChildProcess | null = null;
  private exited: Promise<void> | null = null;
  private log: WriteStream | null = null;

  constructor(private readonly options: ServerOptions) {
    this.name = options.name;
    this.dataDir = mkdtempSync(path.join(os.tmpdir(), `contend-e2e-${options.name}-`));
    mkdirSync(path.join(RESULTS_DIR, "server-logs"), { recursive: true });
    this.logPath = path.join(RESULTS_DIR, "server-logs", `${options.name}-${process.pid}.log`);
  }

  get baseURL(): string {
    return `http://127.0.0.1:${this.port}`;
  }

  /** Starts the server (a free port the first time, the same port afterwards) and waits for health. */
  async start(): Promise<void> {
    if (this.child) throw new Error(`server ${this.name} is already running`);
    if (this.port === 0) this.port = await freePort();
    this.starts += 1;
    this.log ??= createWriteStream(this.logPath, { flags: "a" });
    this.log.write(
      `\n=== start #${this.starts} on port ${this.port} at ${new Date().toISOString()}\n`,
    );
    // node --import tsx runs the TypeScript entry in this very process (no tsx wrapper child),
    // so killing the pid kills the server itself.
    const child = spawnServer({
      env: {
        NODE_ENV: "production",
        PORT: String(this.port),
        HOST: "127.0.0.1",
        CONTEND_DATA_DIR: this.dataDir,
        DATABASE_URL: "",
        DEMO: "off",
        WEB: "on",
        LOG_LEVEL: "info",
        // Several browser contexts share 127.0.0.1; keep the per-connection limits generous.
        RATE_LIMIT_PER_SECOND: "200",
        RATE_LIMIT_BURST: "400",
        // ... and the per-address ones (every context comes from 127.0.0.1; the server tests
        // measure the limits themselves).
        LIMIT_CONNECTIONS_PER_IP: "100000",
        LIMIT_CONNECTS_PER_IP_PER_MINUTE: "100000",
        LIMIT_MESSAGES_PER_IP_PER_SECOND: "100000",
        LIMIT_AUTH_FAILURES_PER_IP_PER_MINUTE: "100000",
        LIMIT_SESSIONS_PER_IP_PER_HOUR: "100000",
        CONTEND_OPERATOR_KEY: E2E_OPERATOR_KEY,
        ...this.options.env,
      },
      detached: true,
    });
    this.child = child;
    child.stdout?.pipe(this.log, { end: false });
    child.stderr?.pipe(this.log, { end: false });
    this.exited = new Promise((resolve) => {
      child.once("exit", (code, signal) => {
        this.log?.write(`=== exit code=${code} signal=${signal}\n`);
        if (this.child === child) this.child = null;
        resolve();
      });
    });
    await this.waitForHealth(child);
  }

  private async waitForHealth(child: ChildProcess): Promise<void> {
    await waitForHttp(`${this.baseURL}/api/health`, child, {
      timeoutMs: this.options.startTimeoutMs ?? 90_000,
      tail: () => this.logTail(),
      pollMs: 250,
    });
  }

  /**
   * Stops the server. SIGKILL models a crash (no shutdown hooks run); SIGTERM a normal stop.
   * The whole process group is signalled so nothing the server spawned keeps the port.
   */
  async stop(signal: NodeJS.Signals = "SIGTERM"): Promise<void> {
    const child = this.child;
    if (!child || child.pid === undefined) return;
    try {
      process.kill(-child.pid, signal);
    } catch {
      child.kill(signal);
    }
    const timer = setTimeout(() => {
      try {
        process.kill(-child.pid!, "SIGKILL");
      } catch {
        // already gone
      }
    }, 10_000);
    await this.exited;
    clearTimeout(timer);
    this.child = null;
  }

  /** Kills the process and starts a new one on the same port and data directory. */
  async restart(signal: NodeJS.Signals = "SIGKILL"): Promise<void> {
    await this.stop(signal);
    await this.start();
  }

  /** Stops the server and removes its data directory. */
  async dispose(): Promise<void> {
    await this.stop("SIGTERM");
    this.log?.end();
    rmSync(this.dataDir, { recursive: true, force: true });
  }

  logTail(lines = 40): string {
    try {
      return readFileSync(this.logPath, "utf8").split("\n").slice(-lines).join("\n");
    } catch {
      return "(no log)";
    }
  }
}
