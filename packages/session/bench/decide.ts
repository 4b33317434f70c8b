/**
 * Prints how long openRound (computer moves) and closeRound (resolution with the solver) take
 * for a 64-seat session under each contest form, and for sessions with fronts (the roaster
 * demo, and the live maximum of 64 seats x 12 fronts). Numbers only; no pass/fail.
 * Run: npm run bench -w @contend/session
 */
import { readFileSync } from "node:fs";
import { parseSessionScenario } from "@contend/protocol";
import type { AnySessionScenario } from "@contend/protocol";
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
  timeRounds(`${JSON.stringify(csf)}  64 seats`, parsed.value);
}

/** Three rounds of openRound + closeRound by the facilitator; the milliseconds of each. */
function timeRounds(label: string, scenario: AnySessionScenario) {
  let state = fold([]);
  let seq = 0;
  const commit = (body: Omit<SessionEvent, "seq" | "at">) => {
    state = apply(state, { ...body, seq: ++seq, at: 0 } as SessionEvent);
  };
  commit(createSession({ sessionId: "bench", scenario: scenario, seed: 1 }));
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
    `${label}  openRound ms: ${fmt(times.openRound!)}  closeRound ms: ${fmt(times.closeRound!)}`,
  );
}

const roaster = JSON.parse(
  readFileSync(new URL("../../solver/scenarios/roaster-districts.json", import.meta.url), "utf8"),
) as Record<string, unknown>;
const demo = parseSessionScenario({
  ...roaster,
  session: { computer: { "Bluebird Beanery": { kind: "equilibrium" } }, rounds: 3 },
});
if (!demo.ok) throw new Error(demo.message);
timeRounds("fronts: roaster demo, 3 seats x 4 fronts", demo.value);

const K = 12;
const wide = parseSessionScenario({
  title: "Regional ad budgets",
  fronts: Array.from({ length: K }, (_, k) => ({
    name: `Region ${k + 1}`,
    prize: 50_000 + 5_000 * k,
    csf: { kind: "ratio", decisiveness: k % 3 === 0 ? 1 : 0.8 },
  })),
  rivals: Array.from({ length: 64 }, (_, i) => ({
    name: `Chain ${i}`,
    cost: Array.from({ length: K }, (_, k) => 1 + ((i + k) % 5) * 0.1),
    budget: 20_000 + 1_000 * (i % 10),
  })),
  session: {
    computer: Object.fromEntries(
      Array.from({ length: 32 }, (_, i) => [
        `Chain ${i}`,
        { kind: i % 2 === 0 ? "equilibrium" : "best-reply" },
      ]),
    ),
    rounds: 3,
  },
});
if (!wide.ok) throw new Error(wide.message);
timeRounds(`fronts: 64 seats x ${K} fronts`, wide.value);
