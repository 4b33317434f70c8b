/**
 * The PGlite thread: owns the one PGlite instance of the process, with Prisma's PGlite adapter
 * and the raw SQL runner on top of it, and answers the main thread's requests (see messages.ts).
 * PGlite runs its WebAssembly on the thread that calls it, so a commit here no longer holds up
 * the main thread's sockets and timers.
 */
import { parentPort, workerData } from "node:worker_threads";
import { PGlite } from "@electric-sql/pglite";
import { PrismaPGlite } from "pglite-prisma-adapter";
import { useLeanParsers } from "../pgliteParsers";
import { pgliteRunner, type SqlTx } from "../sqlRunner";
import { toWire, type Envelope, type Ready, type Reply } from "./messages";

interface Queryable {
  queryRaw(query: unknown): Promise<unknown>;
  executeRaw(query: unknown): Promise<number>;
}
interface AdapterTx extends Queryable {
  commit(): Promise<void>;
  rollback(): Promise<void>;
}
interface Adapter extends Queryable {
  executeScript(script: string): Promise<void>;
  startTransaction(isolationLevel?: string): Promise<AdapterTx>;
}

interface Open {
  settle(commit: boolean): void;
  done: Promise<unknown>;
  tx: SqlTx;
}

class Rollback extends Error {}

async function main() {
  const port = parentPort;
  if (!port) throw new Error("pglite thread: not started as a worker");
  const { dataDir, wasmModule } = workerData as {
    dataDir: string | null;
    wasmModule: WebAssembly.Module;
  };
  let pglite: PGlite;
  let adapter: Adapter;
  try {
    pglite = dataDir
      ? await PGlite.create(dataDir, { wasmModule })
      : await PGlite.create({ wasmModule });
    await useLeanParsers(pglite);
    adapter = (await new PrismaPGlite(pglite).connect()) as unknown as Adapter;
  } catch (error) {
    port.postMessage({ ready: false, error: toWire(error) } satisfies Ready);
    return;
  }
  const runner = pgliteRunner(pglite);
  const adapterTxs = new Map<number, AdapterTx>();
  const runnerTxs = new Map<number, Open>();
  let nextTx = 1;

  function adapterTx(id: number): AdapterTx {
    const tx = adapterTxs.get(id);
    if (!tx) throw new Error(`no open transaction ${id}`);
    return tx;
  }
  function runnerTx(id: number): Open {
    const open = runnerTxs.get(id);
    if (!open) throw new Error(`no open transaction ${id}`);
    return open;
  }

  /** Resolves once fn runs inside the transaction; the transaction ends when settle is called. */
  function beginRunnerTx(): Promise<number> {
    return new Promise((started, failed) => {
      const id = nextTx++;
      const done: Promise<unknown> = runner.transaction(
        (tx) =>
          new Promise<void>((commit, rollback) => {
            const settle = (ok: boolean) => (ok ? commit() : rollback(new Rollback()));
            runnerTxs.set(id, { settle, done, tx });
            started(id);
          }),
      );
      // A transaction that failed before fn ran rejects here, and the caller learns it.
      done.catch(failed);
    });
  }

  async function handle(request: Envelope): Promise<unknown> {
    switch (request.op) {
      case "adapter.query": {
        const target = request.tx === null ? adapter : adapterTx(request.tx);
        return request.rows ? target.queryRaw(request.query) : target.executeRaw(request.query);
      }
      case "adapter.script":
        return adapter.executeScript(request.script);
      case "adapter.begin": {
        const tx = await adapter.startTransaction(request.isolationLevel);
        const id = nextTx++;
        adapterTxs.set(id, tx);
        return id;
      }
      case "adapter.end": {
        const tx = adapterTx(request.tx);
        adapterTxs.delete(request.tx);
        return request.commit ? tx.commit() : tx.rollback();
      }
      case "runner.query":
        return request.tx === null
          ? runner.query(request.sql, request.params)
          : runnerTx(request.tx).tx.query(request.sql, request.params);
      case "runner.exec":
        return runnerTx(request.tx).tx.exec(request.script);
      case "runner.prepared":
        return runner.prepared(request.statement, request.params);
      case "runner.begin":
        return beginRunnerTx();
      case "runner.end": {
        const open = runnerTx(request.tx);
        runnerTxs.delete(request.tx);
        open.settle(request.commit);
        try {
          await open.done;
        } catch (error) {
          if (!(error instanceof Rollback)) throw error;
        }
        return undefined;
      }
      case "close":
        await pglite.close();
        return undefined;
    }
  }

  port.on("message", (request: Envelope) => {
    handle(request).then(
      (value) => port.postMessage({ id: request.id, ok: true, value } satisfies Reply),
      (error: unknown) =>
        port.postMessage({ id: request.id, ok: false, error: toWire(error) } satisfies Reply),
    );
  });
  port.postMessage({ ready: true } satisfies Ready);
}

void main();
