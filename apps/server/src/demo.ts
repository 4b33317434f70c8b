/**
 * A ready-made session for the first start: the invented station-kiosk scenario from the
 * solver's examples, three rounds, one rival played by the computer.
 */
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import type { Database } from "@contend/db";
import { parseSessionScenario } from "@contend/protocol";
import type { CreateSessionResponse } from "@contend/protocol";
import { createLiveSession } from "./live/create";

/** The solver's invented example, through its package exports (not a path into its folder). */
export const DEMO_SCENARIO_FILE = fileURLToPath(
  import.meta.resolve("@contend/solver/scenarios/kiosk-lease.json"),
);

export function demoScenario(): unknown {
  const contest = JSON.parse(readFileSync(DEMO_SCENARIO_FILE, "utf8")) as {
    rivals: { name: string }[];
  };
  const computerRival = contest.rivals[contest.rivals.length - 1]?.name ?? "";
  return {
    ...contest,
    session: {
      outcome: "shares",
      spendStep: 100,
      rounds: 3,
      clockSeconds: null,
      missingMove: "zero",
      computer: { [computerRival]: { kind: "equilibrium" } },
    },
  };
}

/** Creates the demo session when the database holds no session at all. */
export async function ensureDemoSession(
  db: Database,
  opts: { now: number; baseUrl: string },
): Promise<CreateSessionResponse | null> {
  if ((await db.sessions.list()).length > 0) return null;
  const parsed = parseSessionScenario(demoScenario());
  if (!parsed.ok) throw new Error(`bundled demo scenario is invalid: ${parsed.message}`);
  return createLiveSession(db, parsed.value, opts);
}

export function describeLinks(created: CreateSessionResponse): string {
  const lines = [
    `Demo session "${created.id}" (join code ${created.joinCode})`,
    `  facilitator : ${created.links.facilitator}`,
    `  big screen  : ${created.links.spectator}`,
    ...created.seats.map((s) =>
      s.link
        ? `  seat ${s.index} (${s.name}) : ${s.link}`
        : `  seat ${s.index} (${s.name}) : played by the computer`,
    ),
    `  join page   : ${created.links.join}`,
    "These links carry the session's keys and are shown only now; keep them.",
  ];
  return lines.join("\n");
}
