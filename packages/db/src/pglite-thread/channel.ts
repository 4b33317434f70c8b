/**
 * Requests to a worker thread, each settled by the reply with its id (see messages.ts). A
 * thread that ends takes its database with it: every waiting and later call fails, and `lost`
 * says so, unless the end came from `close`.
 */
import type { Worker } from "node:worker_threads";
import { fromWire, type Envelope, type Reply, type Request } from "./messages";

export interface Channel {
  call<T>(request: Request): Promise<T>;
  /** resolves, with the reason, if the thread ends without being closed; never rejects */
  lost: Promise<Error>;
  /** sends `last` (if the thread still runs) and waits for its reply, then ends the thread */
  close(last: Request): Promise<void>;
}

export function openChannel(worker: Worker): Channel {
  const pending = new Map<number, { resolve(v: unknown): void; reject(e: unknown): void }>();
  let nextId = 1;
  let stopped: Error | null = null;
  let closing = false;
  let onLost: (error: Error) => void = () => undefined;
  const lost = new Promise<Error>((resolve) => (onLost = resolve));

  // Like PGlite in-process, an idle database does not keep the process alive; a waiting call does.
  worker.unref();
  worker.on("message", (reply: Reply) => {
    const waiter = pending.get(reply.id);
    if (!waiter) return;
    pending.delete(reply.id);
    if (pending.size === 0) worker.unref();
    if (reply.ok) waiter.resolve(reply.value);
    else waiter.reject(fromWire(reply.error));
  });
  const fail = (error: Error) => {
    if (!stopped && !closing) onLost(error);
    stopped ??= error;
    for (const waiter of pending.values()) waiter.reject(stopped);
    pending.clear();
  };
  worker.on("error", (error) => fail(new Error(`the database thread failed: ${error.message}`)));
  worker.on("exit", (code) => fail(new Error(`the database thread exited (code ${code})`)));

  function call<T>(request: Request): Promise<T> {
    if (stopped) return Promise.reject(stopped);
    const id = nextId++;
    if (pending.size === 0) worker.ref();
    return new Promise<T>((resolve, reject) => {
      pending.set(id, { resolve: resolve as (v: unknown) => void, reject });
      worker.postMessage({ ...request, id } satisfies Envelope);
    });
  }

  return {
    call,
    lost,
    async close(last) {
      try {
        if (!stopped) await call(last);
      } finally {
        closing = true;
        await worker.terminate();
      }
    },
  };
}
