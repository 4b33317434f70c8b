/**
 * Every random stream of a session is derived from its seed, so that replaying a session (or
 * re-running decide on the same log) gives the same computer moves and the same winners.
 */
import { deriveSeed } from "@contend/solver";

// Distinct tags keep the streams apart even where (round, seat) coincide.
const COMPUTER_MOVE = 1;
const WINNER_DRAW = 2;

/** Seed of the policy that plays `seatIndex` in `round`. */
export function computerSeed(sessionSeed: number, round: number, seatIndex: number): number {
  return deriveSeed(sessionSeed, COMPUTER_MOVE, round, seatIndex);
}

/** Seed of the generator that draws the winner of `round` (winner mode). */
export function drawSeedFor(sessionSeed: number, round: number): number {
  return deriveSeed(sessionSeed, WINNER_DRAW, round);
}
