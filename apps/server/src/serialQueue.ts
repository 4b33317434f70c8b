/**
 * Runs tasks of one key strictly one after another, in arrival order; different keys run
 * independently. A failing task does not block the ones behind it.
 */
export interface SerialQueue {
  run<T>(key: string, task: () => Promise<T>): Promise<T>;
  /** resolves when every queued task of every key has settled */
  idle(): Promise<void>;
}

export function createSerialQueue(): SerialQueue {
  const tails = new Map<string, Promise<unknown>>();
  return {
    run(key, task) {
      const previous = tails.get(key) ?? Promise.resolve();
      const result = previous.then(task, task);
      const tail = result.then(
        () => undefined,
        () => undefined,
      );
      tails.set(key, tail);
      void tail.then(() => {
        if (tails.get(key) === tail) tails.delete(key);
      });
      return result;
    },
    async idle() {
      while (tails.size > 0) await Promise.all([...tails.values()]);
    },
  };
}
