import type { EventOf, SessionScenario } from "@contend/protocol";

/**
 * The first event of every session. The caller validates the scenario (parseSessionScenario)
 * and supplies the id and the seed (any integer; used modulo 2^32), so this stays pure.
 */
export function createSession(input: {
  sessionId: string;
  scenario: SessionScenario;
  seed: number;
}): EventOf<"session-created"> {
  const { scenario } = input;
  return {
    type: "session-created",
    sessionId: input.sessionId,
    scenario,
    seats: scenario.rivals.map((r, index) => {
      const policy = scenario.session.computer[r.name] ?? null;
      return { index, name: r.name, kind: policy ? "computer" : "human", policy };
    }),
    seed: Math.trunc(input.seed) >>> 0,
  };
}
