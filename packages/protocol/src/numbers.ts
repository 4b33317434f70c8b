import { z } from "zod";
import { LIMITS } from "./limits";

/** A finite number in [0, LIMITS.effortMax]; NaN, Infinity and huge values are refused. */
export const effortSchema = z
  .number({ error: "must be a finite number" })
  .min(0, { error: "must be >= 0" })
  .max(LIMITS.effortMax, { error: `must be <= ${LIMITS.effortMax}` });

export const positiveNumberSchema = z
  .number({ error: "must be a finite number" })
  .gt(0, { error: "must be > 0" })
  .max(LIMITS.numberMax, { error: `must be <= ${LIMITS.numberMax}` });

/** Seat (rival) index inside a session. */
export const seatIndexSchema = z
  .int({ error: "must be an integer seat index" })
  .min(0, { error: "must be >= 0" })
  .max(LIMITS.seatsMax - 1, { error: `must be < ${LIMITS.seatsMax}` });

/** 1-based round number. */
export const roundNumberSchema = z
  .int({ error: "must be an integer round number" })
  .min(1, { error: "must be >= 1" })
  .max(LIMITS.roundsMax, { error: `must be <= ${LIMITS.roundsMax}` });

/** Epoch milliseconds. */
export const epochMsSchema = z.number().int().min(0);

/** Any finite number (results computed by the solver). */
export const finiteSchema = z.number({ error: "must be a finite number" });
