/**
 * The state a session's event log folds into. Status is a discriminated union; `paused` is a
 * flag on top of it. Arrays indexed by seat grow when a shock adds a rival; seats are never
 * removed (a retired rival's seat stays with active = false).
 */
import type { FrontsScenario, PolicySpec, Scenario } from "@contend/solver";
import type {
  AnySessionScenario,
  EndReason,
  RobustPlanRecord,
  RoundResult,
  SessionSettings,
  ShockRecord,
} from "@contend/protocol";

export interface SeatState {
  index: number;
  name: string;
  /** non-null: played by the computer with this policy */
  policy: PolicySpec | null;
  claimed: boolean;
  displayName: string | null;
  active: boolean;
}

export interface SealedMove {
  effort: number;
  /** money: cost x effort as sealed (older logs: derived from the effort) */
  spend: number;
  clientMoveId: string;
  by: "seat" | "computer";
  /** clientMoveIds of moves this one replaced in the same round */
  replacedIds: string[];
  /** the seat's one-line reason (private until the round resolves); null: none */
  reason: string | null;
  /** sessions with fronts: money on each front (effort and spend are then the total money) */
  frontSpends: number[] | null;
}

export interface OpenRound {
  round: number;
  /** active rivals only, in seat order */
  scenario: Scenario;
  seatIndices: number[];
  /** null while paused or when the round has no clock */
  deadline: number | null;
  /** indexed by seat */
  moves: (SealedMove | null)[];
}

export interface SessionCore {
  sessionId: string;
  /** seq of the last event applied */
  seq: number;
  /** `at` of the last event applied */
  at: number;
  seed: number;
  /** the scenario the session was created with */
  initial: AnySessionScenario;
  settings: SessionSettings;
  /**
   * current contest; rivals[k] belongs to seat k, retired ones included. A session with fronts
   * holds its single-contest summary here (frontsRoster, R45) and the fronts in `fronts`.
   */
  scenario: Scenario;
  /** sessions with fronts: the fronts scenario (it does not change: no shocks, R50) */
  fronts: FrontsScenario | null;
  seats: SeatState[];
  rounds: RoundResult[];
  /** running totals of realised payoffs, indexed by seat */
  totals: number[];
  shocks: ShockRecord[];
  paused: boolean;
  /** while paused in an open round with a clock: the time that was left */
  remainingMs: number | null;
}

export type SessionState =
  | { status: "empty"; seq: 0 }
  | (SessionCore & { status: "lobby" })
  | (SessionCore & { status: "open"; open: OpenRound })
  | (SessionCore & { status: "review" })
  | (SessionCore & {
      status: "ended";
      endedReason: EndReason;
      /** sessions with private numbers: each seat's robust plan (R44) */
      robustPlans: RobustPlanRecord[];
    });

export type LiveState = Exclude<SessionState, { status: "empty" }>;

export function initialState(): SessionState {
  return { status: "empty", seq: 0 };
}

/**
 * Contest of the active seats only, with the seat behind each of its rivals. Takes any shape
 * with the scenario and the seats' `active` flags (the state, or a role view of it), so the web
 * previews the coming round with the engine's own rule.
 */
export function activeContest(core: {
  scenario: Scenario;
  seats: readonly { index: number; active: boolean }[];
}): { scenario: Scenario; seatIndices: number[] } {
  const seatIndices = core.seats.filter((s) => s.active).map((s) => s.index);
  const rivals = seatIndices.map((i) => core.scenario.rivals[i]!);
  return { scenario: { ...core.scenario, rivals }, seatIndices };
}
