/**
 * The main thread's side of the PGlite thread (thread.ts): starts it, and hands out a Prisma
 * driver-adapter factory and a SqlRunner whose calls travel to it as messages. The adapter
 * itself (pglite-prisma-adapter) runs on the PGlite thread, so its result parsing and error
 * translation are unchanged; only the results cross over.
 */
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import type { PreparedStatement, PreparedValue, SqlRunner, SqlTx } from "../sqlRunner";
import { openChannel } from "./channel";
import { fromWire, type Ready } from "./messages";

const THREAD_MAIN = new URL("./thread.ts", import.meta.url).href;

/**
 * tsx's ESM API, found through its package exports: vitest's module runner has no
 * import.meta.resolve, and the API's CommonJS build cannot load files from ESM.
 */
function tsxEsmApi(): string {
  const require = createRequire(import.meta.url);
  const manifest = require.resolve("tsx/package.json");
  const { exports } = JSON.parse(readFileSync(manifest, "utf8")) as {
    exports: Record<string, { import?: { default?: string } }>;
  };
  const entry = exports["./esm/api"]?.import?.default;
  if (!entry) throw new Error("tsx no longer exports ./esm/api for import");
  return pathToFileURL(path.join(path.dirname(manifest), entry)).href;
}

/**
 * The thread's first code: it loads thread.ts through tsx, as the rest of the project runs.
 * (Node 20 applies neither the parent's nor an `--import`ed module loader to a worker's entry.)
 */
const BOOT = `import(${JSON.stringify(tsxEsmApi())}).then(({ tsImport }) => tsImport(${JSON.stringify(THREAD_MAIN)}, ${JSON.stringify(import.meta.url)}));`;

/**
 * A compiled WebAssembly.Module, kept opaque here: @types/node 20 declares neither the global
 * nor its namespace, and packages that import this file without PGlite's types (the benchmarks)
 * would not see them. Only the thread (thread.ts), which imports PGlite, names the real type.
 */
type CompiledWasm = object;

let compiled: Promise<CompiledWasm> | null = null;
const wasm = (
  globalThis as unknown as {
    WebAssembly: { compile(bytes: Uint8Array): Promise<CompiledWasm> };
  }
).WebAssembly;

/**
 * PGlite's WebAssembly, compiled once per process and handed to every thread: a thread that
 * gets it opens in about half the time (measured: ~1.1 s against ~1.9 s for an in-memory
 * database), as V8 shares the compiled code between threads. The file sits beside PGlite's
 * entry point, which is where PGlite itself loads it from.
 */
function pgliteWasm(): Promise<CompiledWasm> {
  compiled ??= (async () => {
    const entry = createRequire(import.meta.url).resolve("@electric-sql/pglite");
    return wasm.compile(readFileSync(path.join(path.dirname(entry), "pglite.wasm")));
  })();
  return compiled;
}

export interface PgliteThread {
  /** for `new PrismaClient({ adapter })` */
  adapter: unknown;
  runner: SqlRunner;
  /** resolves if the thread ends on its own (a crash): the database is gone until a restart */
  lost: Promise<Error>;
  /** closes the database, then ends the thread */
  close(): Promise<void>;
}

/** Opens the database (a directory, or in memory for null) on a new thread. */
export async function startPgliteThread(dataDir: string | null): Promise<PgliteThread> {
  const wasmModule = await pgliteWasm();
  const worker = new Worker(BOOT, { eval: true, workerData: { dataDir, wasmModule } });
  const ready = new Promise<void>((resolve, reject) => {
    const onMessage = (message: Ready) => {
      worker.off("message", onMessage);
      if (message.ready) resolve();
      else reject(fromWire(message.error));
    };
    worker.on("message", onMessage);
    worker.once("error", reject);
    worker.once("exit", (code) => reject(new Error(`the database thread exited (code ${code})`)));
  });
  try {
    await ready;
  } catch (error) {
    await worker.terminate();
    throw error;
  }

  const { call, lost, close } = openChannel(worker);

  function queryable(tx: number | null) {
    return {
      provider: "postgres" as const,
      adapterName: "pglite-prisma-adapter",
      queryRaw: (query: unknown) => call({ op: "adapter.query", tx, query, rows: true }),
      executeRaw: (query: unknown) => call<number>({ op: "adapter.query", tx, query, rows: false }),
    };
  }

  const connection = {
    ...queryable(null),
    executeScript: (script: string) => call<void>({ op: "adapter.script", script }),
    async startTransaction(isolationLevel?: string) {
      const tx = await call<number>({ op: "adapter.begin", isolationLevel });
      return {
        ...queryable(tx),
        options: { usePhantomQuery: true },
        commit: () => call<void>({ op: "adapter.end", tx, commit: true }),
        rollback: () => call<void>({ op: "adapter.end", tx, commit: false }),
      };
    },
    getConnectionInfo: () => ({ supportsRelationJoins: true }),
    dispose: () => Promise.resolve(),
  };

  const adapter = {
    provider: "postgres" as const,
    adapterName: "pglite-prisma-adapter",
    connect: () => Promise.resolve(connection),
  };

  const runner: SqlRunner = {
    async transaction<T>(fn: (tx: SqlTx) => Promise<T>): Promise<T> {
      const tx = await call<number>({ op: "runner.begin" });
      let result: T;
      try {
        result = await fn({
          exec: (script) => call<void>({ op: "runner.exec", tx, script }),
          query: <Row extends Record<string, unknown>>(sql: string, params?: unknown[]) =>
            call<Row[]>({ op: "runner.query", tx, sql, params }),
        });
      } catch (error) {
        await call({ op: "runner.end", tx, commit: false }).catch(() => undefined);
        throw error;
      }
      await call({ op: "runner.end", tx, commit: true });
      return result;
    },
    query: <Row extends Record<string, unknown>>(sql: string, params?: unknown[]) =>
      call<Row[]>({ op: "runner.query", tx: null, sql, params }),
    prepared: <Row extends Record<string, unknown>>(
      statement: PreparedStatement,
      params: readonly PreparedValue[],
    ) => call<Row[]>({ op: "runner.prepared", statement, params }),
  };

  return {
    adapter,
    runner,
    lost,
    close: () => close({ op: "close" }),
  };
}
