export { initialState, activeContest } from "./state";
export type {
  LiveState,
  OpenRound,
  SealedMove,
  SeatState,
  SessionCore,
  SessionState,
} from "./state";
export { apply, fold } from "./apply";
export { decide } from "./decide";
export type { Actor, DecideContext, EngineCommand, SystemCommand } from "./decide";
export type { DecideData, Decision, Rejection } from "./result";
export { viewFor, withoutComputer, withoutDrawSeeds } from "./view";
export { WITHHELD_UNTIL_END, withholdSecrets } from "./redact";
export type { Viewer } from "./view";
export { allSealed, deadline } from "./timers";
export { createSession } from "./create";
export { computerSeed, drawSeedFor } from "./seeds";
export { computerMoveId } from "./computer";
export {
  EFFORT_TOLERANCE,
  checkMove,
  checkSpend,
  largestSpendWithin,
  onStep,
  snapToStep,
  spendProblemText,
  withinBudget,
} from "./effort";
export type { SpendCheck } from "./effort";
export { roundWithMoney } from "./money";
export { placementText, spendPlacement } from "./placement";
export type { SpendPlacement } from "./placement";
export { shockText } from "./shockText";
export { NEAR_BEST_REPLY, summarizeSession } from "./summary";
export type { SummaryOptions } from "./summary";
export { truthSealed, truthWithheld, withHidden } from "./hiddenView";
export { BELIEF_DRAWS, PLAN_DRAWS, drawTruth } from "./hidden";
export { allocationProblemText, checkAllocation } from "./allocation";
export type { AllocationCheck, AllocationTerms } from "./allocation";
export { fitAllocation, roundFronts } from "./frontsPlay";
