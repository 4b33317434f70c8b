/**
 * Prints how long openRound (computer moves) and closeRound (resolution with the solver) take
 * for a 64-seat session under each contest form. Numbers only; no pass/fail.
 * Run: npm run bench -w @contend/session
 */
import { parseSessionScenario } from "@contend/protocol";
import type { SessionEvent } from "@contend/protocol";
import { apply, createSession, decide, fold } from "../src/index";
import type { EngineCommand } from "../src/index";

const forms = [
  { kind: "ratio", decisiveness: 0.8 },
  { kind: "ratio", decisiveness: 1.5 },
  { kind: "logit", scale: 0.05 },
  { kind: "allpay" },
];
const kinds = ["equilibrium", "best-reply", "fictitious-play", "overspender"];

for (const csf of forms) {
  const rivals = Array.from({ length: 64 }, (_, i) => ({
    name: `Stall ${i}`,
    cost: 1 + (i % 7) * 0.1,
  }));
  const computer = Object.fromEntries(
    rivals.slice(0, 32).map((r, i) => [r.name, { kind: kinds[i % kinds.length] }]),
  );
  const parsed = parseSessionScenario({
    title: "Market stalls",
    prize: 100,
    csf,
    rivals,
    session: { computer, rounds: 3 },
  });
  if (!parsed.ok) throw new Error(parsed.message);
  let state = fold([]);
  let seq = 0;
  const commit = (body: Omit<SessionEvent, "seq" | "at">) => {
    state = apply(state, { ...body, seq: ++seq, at: 0 } as SessionEvent);
  };
  commit(createSession({ sessionId: "bench", scenario: parsed.value, seed: 1 }));
  const times: Record<string, number[]> = { openRound: [], closeRound: [] };
  for (let round = 0; round < 3; round++) {
    for (const type of ["openRound", "closeRound"] as const) {
      const t0 = performance.now();
      const d = decide(state, { type } as EngineCommand, {
        now: 0,
        actor: { role: "facilitator" },
      });
      times[type]!.push(performance.now() - t0);
      if (!d.ok) throw new Error(d.message);
      d.events.forEach(commit);
    }
  }
  const fmt = (xs: number[]) => xs.map((x) => x.toFixed(1)).join(" / ");
  console.log(
    `${JSON.stringify(csf)}  64 seats  openRound ms: ${fmt(times.openRound!)}  closeRound ms: ${fmt(times.closeRound!)}`,
  );
}
