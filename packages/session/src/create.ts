import { isFrontsSession } from "@contend/protocol";
import type { AnySessionScenario, EventOf } from "@contend/protocol";
import { drawTruth } from "./hidden";

/**
 * The first event of every session. The caller validates the scenario (parseSessionScenario)
 * and supplies the id and the seed (any integer; used modulo 2^32), so this stays pure.
 */
export function createSession(input: {
  sessionId: string;
  scenario: AnySessionScenario;
  seed: number;
}): EventOf<"session-created"> {
  const seed = Math.trunc(input.seed) >>> 0;
  // private numbers are for single contests only (R45)
  const scenario = isFrontsSession(input.scenario)
    ? input.scenario
    : drawTruth(input.scenario, seed);
  return {
    type: "session-created",
    sessionId: input.sessionId,
    scenario,
    seats: scenario.rivals.map((r, index) => {
      // Own keys only: a name never reaches the prototype chain (the text rule refuses
      // reserved names too; this keeps the lookup safe for any caller).
      const computer = scenario.session.computer;
      const policy = Object.hasOwn(computer, r.name) ? (computer[r.name] ?? null) : null;
      return { index, name: r.name, kind: policy ? "computer" : "human", policy };
    }),
    seed,
  };
}
