"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { proxy, wrap, type Remote } from "comlink";
import type { UncertainWorkerApi } from "../workers/uncertain.worker";

export type WorkerTaskState<T> =
  | { status: "idle"; cancelled?: boolean }
  | { status: "running"; done: number; total: number }
  | { status: "done"; value: T; ms: number }
  | { status: "error"; message: string };

type OnProgress = (done: number, total: number) => void;

interface Live {
  worker: Worker;
  api: Remote<UncertainWorkerApi>;
}

/**
 * One task at a time in the uncertainty Web Worker: the page only receives progress messages
 * and the answer, so it stays responsive. Starting a task while one is going, cancelling, or
 * leaving the page terminates the worker in flight (the next task starts a new one).
 */
export function useUncertainWorker<T>() {
  const [state, setState] = useState<WorkerTaskState<T>>({ status: "idle" });
  const live = useRef<Live | null>(null);

  const stop = useCallback(() => {
    live.current?.worker.terminate();
    live.current = null;
  }, []);

  useEffect(() => stop, [stop]);

  const start = useCallback(
    (
      total: number,
      call: (api: Remote<UncertainWorkerApi>, onProgress: OnProgress) => Promise<T>,
    ) => {
      stop();
      const worker = new Worker(new URL("../workers/uncertain.worker.ts", import.meta.url), {
        type: "module",
      });
      const mine: Live = { worker, api: wrap<UncertainWorkerApi>(worker) };
      live.current = mine;
      const started = performance.now();
      setState({ status: "running", done: 0, total });
      const onProgress = proxy((done: number, all: number) => {
        if (live.current === mine) setState({ status: "running", done, total: all });
      });
      call(mine.api, onProgress)
        .then((value) => {
          if (live.current !== mine) return;
          stop();
          setState({ status: "done", value, ms: performance.now() - started });
        })
        .catch((e: unknown) => {
          if (live.current !== mine) return;
          stop();
          setState({ status: "error", message: `solver failed: ${(e as Error).message}` });
        });
    },
    [stop],
  );

  const cancel = useCallback(() => {
    stop();
    setState({ status: "idle", cancelled: true });
  }, [stop]);

  return { state, start, cancel };
}
