/** Size and range limits for everything a client may send (checked before any work is done). */
export const LIMITS = {
  /** rivals (seats) in a live session, counting retired ones and rivals added by shocks */
  seatsMax: 64,
  seatsMin: 2,
  /** changes in one applyShock command */
  changesMax: 200,
  /** efforts are finite, >= 0 and at most this */
  effortMax: 1e12,
  /** any other number a client may send (prize, shock values, step) */
  numberMax: 1e12,
  roundsMax: 100,
  clockMinSeconds: 5,
  clockMaxSeconds: 3600,
  clientMoveIdMax: 64,
  displayNameMax: 40,
  sessionIdMax: 64,
  keyMax: 128,
  joinCodeMin: 4,
  joinCodeMax: 16,
  nameMax: 80,
  /** a seat's one-line reason for its move */
  reasonMax: 140,
  /** the facilitator's note on a round */
  noteMax: 500,
  /** fronts in a live session (one money input per front on every seat's screen) */
  frontsMax: 12,
  /** one library tag (after trimming) */
  tagMax: 32,
  /** tags on one session */
  tagsMax: 20,
  /** the text of a library search */
  searchMax: 80,
  /** a saved scenario version's note ("Q3 numbers") */
  versionNoteMax: 140,
  /** moves one seat may seal in one round (its first and every replacement) */
  movesPerSeatPerRound: 30,
} as const;
