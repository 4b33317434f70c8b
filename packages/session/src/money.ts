/**
 * Money beside every effort of a resolved round: spend = cost x effort, per seat. The one place
 * the views, exports and replays get spends from. Logs written before spends were stored carry
 * no `spends`; they are derived here from the efforts and the round's costs, so old logs replay.
 */
import type { EventOf, RoundResult } from "@contend/protocol";
import type { Scenario } from "@contend/solver";

type Resolved = Omit<EventOf<"round-resolved">, "type">;

/** The round as every role reads it: the event's numbers plus spends in money. */
export function roundWithMoney(
  result: Resolved,
  scenario: Scenario,
  seatIndices: readonly number[],
): RoundResult {
  const costOf = (seat: number): number | null => {
    const k = seatIndices.indexOf(seat);
    return k < 0 ? null : scenario.rivals[k]!.cost;
  };
  const money = (values: readonly number[]) =>
    values.map((x, seat) => {
      const cost = costOf(seat);
      return cost === null ? 0 : cost * x;
    });
  const eq = result.equilibrium.efforts ?? result.equilibrium.expectedEfforts ?? null;
  const equilibriumSpends = result.efforts.map((_, seat) => {
    const k = seatIndices.indexOf(seat);
    const e = k < 0 ? undefined : eq?.[k];
    return e === undefined ? null : scenario.rivals[k]!.cost * e;
  });
  return {
    ...result,
    spends: result.spends ?? money(result.efforts),
    scenario,
    seatIndices: [...seatIndices],
    bestResponseSpends: money(result.bestResponses),
    equilibriumSpends,
  };
}
