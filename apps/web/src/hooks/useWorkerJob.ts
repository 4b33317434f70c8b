"use client";

import { useCallback, useEffect, useRef } from "react";
import { proxy, wrap, type Remote } from "comlink";

export type OnProgress = (done: number, total: number) => void;

/** What a finished, failed or progressing job reports; late replies from replaced jobs are dropped. */
export interface JobHandlers<T> {
  progress?: OnProgress;
  done: (value: T, ms: number) => void;
  fail: (message: string) => void;
}

interface Live<Api> {
  worker: Worker;
  api: Remote<Api>;
}

/**
 * One Web Worker job at a time, messaging through comlink. `launch` terminates the job in
 * flight (if any), starts a fresh worker from `create` and calls it; progress, the answer and a
 * failure reach the handlers only while the job is still the current one. `stop` (also run when
 * the page leaves) terminates the job in flight. `create` must be a stable module-level function
 * holding the `new Worker(new URL(...))` expression, so the bundler finds the worker file.
 */
export function useWorkerJob<Api>(create: () => Worker) {
  const live = useRef<Live<Api> | null>(null);

  const stop = useCallback(() => {
    live.current?.worker.terminate();
    live.current = null;
  }, []);

  useEffect(() => stop, [stop]);

  const launch = useCallback(
    <T>(
      call: (api: Remote<Api>, onProgress: OnProgress) => Promise<T>,
      on: JobHandlers<T>,
    ): void => {
      stop();
      const worker = create();
      const mine: Live<Api> = { worker, api: wrap<Api>(worker) };
      live.current = mine;
      const started = performance.now();
      const onProgress = proxy((done: number, total: number) => {
        if (live.current === mine) on.progress?.(done, total);
      });
      call(mine.api, onProgress)
        .then((value) => {
          if (live.current !== mine) return;
          stop();
          on.done(value, performance.now() - started);
        })
        .catch((e: unknown) => {
          if (live.current !== mine) return;
          stop();
          on.fail(`solver failed: ${(e as Error).message}`);
        });
    },
    [create, stop],
  );

  return { launch, stop };
}
