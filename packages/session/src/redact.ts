/**
 * What an export of a session that has not ended may carry (R23): no computer policy (the
 * seats', the scenario's `session.computer`, later policy changes, a rival added by a shock
 * with one), no session seed and no
 * winner-draw seed, since computer moves and draws derive from the seed. Once the session has
 * ended, the whole log is public to whoever may export it.
 */
import type { SessionEvent } from "@contend/protocol";
import { withoutComputer, withoutShockPolicy } from "./view";

/** What `withholdSecrets` leaves out, as named in an export's `withheld`. */
export const WITHHELD_UNTIL_END = ["computer policies", "session seed", "winner-draw seeds"];

export function withholdSecrets(events: readonly SessionEvent[]): SessionEvent[] {
  return events.map((e): SessionEvent => {
    switch (e.type) {
      case "session-created":
        return {
          ...e,
          seed: 0,
          scenario: { ...e.scenario, session: withoutComputer(e.scenario.session) },
          seats: e.seats.map((s) => (s.policy === null ? s : { ...s, policy: null })),
        };
      case "seat-policy-set":
        return e.policy === null ? e : { ...e, policy: null };
      case "shock-applied":
        return withoutShockPolicy(e);
      case "round-resolved":
        return e.drawSeed === null ? e : { ...e, drawSeed: null };
      default:
        return e;
    }
  });
}
