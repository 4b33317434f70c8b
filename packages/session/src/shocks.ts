/**
 * Applies a list of shocks to the session's contest, in order, and re-validates the result with
 * the solver's validator (the one place where contest ranges are defined).
 */
import { validateScenario } from "@contend/solver";
import type { RivalSpec, Scenario } from "@contend/solver";
import { LIMITS } from "@contend/protocol";
import type { Shock } from "@contend/protocol";
import type { SessionCore } from "./state";
import type { Rejection } from "./result";
import { reject } from "./result";

export function applyChanges(
  core: SessionCore,
  changes: readonly Shock[],
): { ok: true; scenario: Scenario } | Rejection {
  const rivals: RivalSpec[] = core.scenario.rivals.map((r) => ({ ...r }));
  const active = core.seats.map((s) => s.active);
  let prize = core.scenario.prize;
  let csf = core.scenario.csf;

  for (let c = 0; c < changes.length; c++) {
    const change = changes[c]!;
    const at = `changes.${c}`;
    switch (change.target) {
      case "rival":
      case "retire-rival": {
        if (change.index >= rivals.length) {
          return reject(
            "not-found",
            `${at}.index: there is no rival ${change.index}`,
            `${at}.index`,
          );
        }
        if (!active[change.index]) {
          return reject(
            "wrong-state",
            `${at}.index: rival ${change.index} (${rivals[change.index]!.name}) is retired`,
            `${at}.index`,
          );
        }
        if (change.target === "retire-rival") {
          active[change.index] = false;
        } else {
          rivals[change.index] = { ...rivals[change.index]!, [change.field]: change.value };
        }
        break;
      }
      case "prize":
        prize = change.value;
        break;
      case "csf":
        csf = change.csf;
        break;
      case "add-rival":
        if (rivals.length >= LIMITS.seatsMax) {
          return reject(
            "too-large",
            `${at}: a live session has at most ${LIMITS.seatsMax} seats, retired ones included`,
            at,
          );
        }
        rivals.push({ ...change.rival });
        active.push(true);
        break;
      default: {
        const never: never = change;
        throw new Error(`unknown shock ${JSON.stringify(never)}`);
      }
    }
  }

  if (active.filter(Boolean).length < LIMITS.seatsMin) {
    return reject(
      "bad-request",
      `changes: at least ${LIMITS.seatsMin} active rivals must remain`,
      "changes",
    );
  }
  const next = validateScenario({ ...core.scenario, prize, csf, rivals });
  if (!next.ok) {
    return reject(
      "bad-request",
      `changes: after these changes, ${next.path}: ${next.message}`,
      "changes",
    );
  }
  return { ok: true, scenario: next.value };
}
