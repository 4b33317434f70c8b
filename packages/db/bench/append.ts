// Prints how long the event log takes on each backend: sequential appends (one event each,
// as the server does per command), a full read, and contended appends from 8 writers.
// Usage: npm run bench -w @contend/db [-- postgres://...]   (PGlite in memory always)
import { performance } from "node:perf_hooks";
import { newJoinCode, openDatabase } from "../src/index";
import { created, sealed } from "../test/fixtures";

const N = 300;
const urls = ["memory://", ...process.argv.slice(2)];

function quantile(sorted: number[], q: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]!;
}

for (const url of urls) {
  const db = await openDatabase({ url });
  const id = `bench-${Date.now()}`;
  await db.sessions.create({
    id,
    joinCode: newJoinCode(),
    title: "bench",
    scenario: {},
    seats: [],
    keys: [],
    firstEvent: created(Date.now()),
  });

  const times: number[] = [];
  for (let seq = 1; seq <= N; seq++) {
    const t0 = performance.now();
    const r = await db.events.append(id, seq, [sealed(Date.now(), 0, 12.5)]);
    times.push(performance.now() - t0);
    if (!r.ok) throw new Error("unexpected conflict");
  }
  times.sort((a, b) => a - b);

  const t1 = performance.now();
  const all = await db.events.list(id);
  const listMs = performance.now() - t1;

  const t2 = performance.now();
  let conflicts = 0;
  await Promise.all(
    Array.from({ length: 8 }, async () => {
      for (let k = 0; k < 10; k++) {
        let expected = (await db.sessions.get(id))!.lastSeq;
        for (;;) {
          const r = await db.events.append(id, expected, [sealed(Date.now(), 1, 7.5)]);
          if (r.ok) break;
          if (r.code !== "conflict") throw new Error(r.code);
          conflicts++;
          expected = r.lastSeq;
        }
      }
    }),
  );
  const contendedMs = performance.now() - t2;

  console.log(
    `${db.kind.padEnd(8)} append p50 ${quantile(times, 0.5).toFixed(2)} ms, p95 ${quantile(times, 0.95).toFixed(2)} ms; ` +
      `list ${all.length} events ${listMs.toFixed(1)} ms; ` +
      `80 contended appends (8 writers) ${contendedMs.toFixed(0)} ms, ${conflicts} conflicts retried`,
  );
  await db.prisma.session.delete({ where: { id } });
  await db.close();
}
