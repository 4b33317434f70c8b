"use client";

import { useCallback, useState } from "react";
import type { Remote } from "comlink";
import type { UncertainWorkerApi } from "../workers/uncertain.worker";
import { useWorkerJob } from "./useWorkerJob";
import type { OnProgress } from "./useWorkerJob";

export type WorkerTaskState<T> =
  | { status: "idle"; cancelled?: boolean }
  | { status: "running"; done: number; total: number }
  | { status: "done"; value: T; ms: number }
  | { status: "error"; message: string };

function createUncertainWorker(): Worker {
  return new Worker(new URL("../workers/uncertain.worker.ts", import.meta.url), {
    type: "module",
  });
}

/**
 * One task at a time in the uncertainty Web Worker: the page only receives progress messages
 * and the answer, so it stays responsive. Starting a task while one is going, cancelling, or
 * leaving the page terminates the worker in flight (the next task starts a new one).
 */
export function useUncertainWorker<T>() {
  const [state, setState] = useState<WorkerTaskState<T>>({ status: "idle" });
  const { launch, stop } = useWorkerJob<UncertainWorkerApi>(createUncertainWorker);

  const start = useCallback(
    (
      total: number,
      call: (api: Remote<UncertainWorkerApi>, onProgress: OnProgress) => Promise<T>,
    ) => {
      setState({ status: "running", done: 0, total });
      launch(call, {
        progress: (done, all) => setState({ status: "running", done, total: all }),
        done: (value, ms) => setState({ status: "done", value, ms }),
        fail: (message) => setState({ status: "error", message }),
      });
    },
    [launch],
  );

  const cancel = useCallback(() => {
    stop();
    setState({ status: "idle", cancelled: true });
  }, [stop]);

  return { state, start, cancel };
}
