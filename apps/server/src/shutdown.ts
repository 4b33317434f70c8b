/**
 * What SIGTERM and SIGINT do: drain (see Application.close: stop taking connections, let the
 * commit under way finish, close every client's transport so it reconnects elsewhere), close
 * the web app and the database, then exit 0. A drain that hangs (a database that stopped
 * answering mid-commit) is cut after graceMs with exit 1, so a supervisor is never stuck.
 */
import type { Clock } from "./clock";
import type { Logger } from "./logger";

/**
 * Time allowed for a drain before the process exits anyway: under the 30 s that supervisors
 * commonly wait between SIGTERM and SIGKILL (common practice, no source).
 */
export const SHUTDOWN_GRACE_MS = 10_000;

export interface ShutdownDeps {
  /** every close, in order (the application, the web app, the database) */
  steps: (() => Promise<void>)[];
  clock: Clock;
  logger: Logger;
  exit: (code: number) => void;
  graceMs?: number;
}

/** Returns the signal handler; a second signal while draining changes nothing. */
export function createShutdown(deps: ShutdownDeps): (signal: string) => Promise<void> {
  const { clock, logger } = deps;
  const graceMs = deps.graceMs ?? SHUTDOWN_GRACE_MS;
  let running: Promise<void> | null = null;
  let exited = false;
  const exit = (code: number) => {
    if (exited) return;
    exited = true;
    deps.exit(code);
  };
  return (signal) => {
    running ??= (async () => {
      logger.info(`${signal}: draining, then shutting down`);
      const force = clock.setTimer(() => {
        logger.error(`shutdown took longer than ${graceMs} ms; exiting`);
        exit(1);
      }, graceMs);
      try {
        for (const step of deps.steps) await step();
        clock.clearTimer(force);
        logger.info("shut down cleanly");
        exit(0);
      } catch (error) {
        clock.clearTimer(force);
        logger.error("shutdown failed", { error });
        exit(1);
      }
    })();
    return running;
  };
}
