/**
 * Starting the real Contend server as a child process, shared by the benchmarks (child.ts) and
 * the browser journeys (e2e/support/server.ts): the same command line (the Node flags `npm
 * start` uses, then `--import tsx apps/server/src/main.ts`, so the pid is the server itself and
 * not a wrapper), a free port, and one wait for the health answer.
 */
import { spawn } from "node:child_process";
import type { ChildProcess } from "node:child_process";
import { readFileSync } from "node:fs";
import { createServer } from "node:net";
import path from "node:path";
import { fileURLToPath } from "node:url";

const here = path.dirname(fileURLToPath(import.meta.url));
export const REPO_ROOT = path.resolve(here, "../../..");
export const SERVER_DIR = path.join(REPO_ROOT, "apps/server");
export const SERVER_MAIN = path.join(SERVER_DIR, "src/main.ts");
export const HOST = "127.0.0.1";

/**
 * The Node flags `npm start` gives the server (apps/server/package.json, config.nodeOptions),
 * so that a measured or tested server runs as deployed.
 */
export function serverNodeFlags(): string[] {
  const pkg = JSON.parse(readFileSync(path.join(SERVER_DIR, "package.json"), "utf8")) as {
    config?: { nodeOptions?: string };
  };
  return (pkg.config?.nodeOptions ?? "").split(" ").filter(Boolean);
}

/** A port that was free a moment ago on 127.0.0.1 (the OS picks it). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.unref();
    srv.once("error", reject);
    srv.listen(0, HOST, () => {
      const address = srv.address();
      const port = typeof address === "object" && address ? address.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

export interface SpawnOptions {
  /** environment on top of this process's own */
  env: Record<string, string>;
  /** the script to run (default: the real server's entry) */
  script?: string;
  /** extra Node flags, e.g. a profiler's */
  nodeArgs?: string[];
  /** own process group, so that a signal to -pid reaches everything it started */
  detached?: boolean;
}

/** Spawns `node <deploy flags> <nodeArgs> --import tsx <script>` with stdout and stderr piped. */
export function spawnServer(opts: SpawnOptions): ChildProcess {
  return spawn(
    process.execPath,
    [...serverNodeFlags(), ...(opts.nodeArgs ?? []), "--import", "tsx", opts.script ?? SERVER_MAIN],
    {
      cwd: REPO_ROOT,
      env: { ...process.env, ...opts.env },
      stdio: ["ignore", "pipe", "pipe"],
      detached: opts.detached ?? false,
    },
  );
}

/**
 * Polls GET url until it answers 200 (with `{ ok: false }` in a JSON body counting as not yet);
 * throws, with the child's recent output, when the child exits first or time runs out.
 */
export async function waitForHttp(
  url: string,
  child: ChildProcess,
  opts: { timeoutMs?: number; tail?: () => string; pollMs?: number } = {},
): Promise<void> {
  const timeoutMs = opts.timeoutMs ?? 60_000;
  const tail = opts.tail ?? (() => "");
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (child.exitCode !== null || child.signalCode !== null) {
      throw new Error(`child exited before answering ${url}:\n${tail()}`);
    }
    try {
      const res = await fetch(url, { signal: AbortSignal.timeout(2000) });
      if (res.ok) {
        const body = (await res.json().catch(() => null)) as { ok?: unknown } | null;
        if (body?.ok !== false) return;
      }
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, opts.pollMs ?? 200));
  }
  throw new Error(`no answer from ${url} within ${timeoutMs} ms:\n${tail()}`);
}
