/**
 * Every random stream of a session is derived from its seed, so that replaying a session (or
 * re-running decide on the same log) gives the same computer moves and the same winners.
 */
import { deriveSeed } from "@contend/solver";

// Distinct tags keep the streams apart even where (round, seat) coincide.
const COMPUTER_MOVE = 1;
const WINNER_DRAW = 2;
const HIDDEN_TRUTH = 3;
const BELIEF_DRAWS = 4;
const ROBUST_PLAN = 5;

/** Seed of the draw of a session's private numbers from their ranges (R40). */
export function truthSeed(sessionSeed: number): number {
  return deriveSeed(sessionSeed, HIDDEN_TRUTH);
}

/** Seed of the sample a seat's belief best reply averages over (R43). */
export function beliefSeed(sessionSeed: number, round: number, seatIndex: number): number {
  return deriveSeed(sessionSeed, BELIEF_DRAWS, round, seatIndex);
}

/** Seed of a seat's robust plan in the debrief (R44). */
export function planSeed(sessionSeed: number, seatIndex: number): number {
  return deriveSeed(sessionSeed, ROBUST_PLAN, seatIndex);
}

/** Seed of the policy that plays `seatIndex` in `round`. */
export function computerSeed(sessionSeed: number, round: number, seatIndex: number): number {
  return deriveSeed(sessionSeed, COMPUTER_MOVE, round, seatIndex);
}

/** Seed of the generator that draws the winner of `round` (winner mode). */
export function drawSeedFor(sessionSeed: number, round: number): number {
  return deriveSeed(sessionSeed, WINNER_DRAW, round);
}
