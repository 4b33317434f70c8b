export { openDatabase, type Database, type OpenOptions } from "./open";
export { resolveTarget, DEFAULT_PGLITE_DIR, type DatabaseTarget } from "./target";
export {
  hashKey,
  newKey,
  newJoinCode,
  normaliseJoinCode,
  JOIN_CODE_ALPHABET,
  JOIN_CODE_LENGTH,
} from "./credentials";
export {
  ensureOperatorKey,
  isOperatorKey,
  OPERATOR_KEY_FILE,
  OPERATOR_KEY_MIN_LENGTH,
} from "./operatorKey";
export type { OperatorKey } from "./operatorKey";
export {
  applyMigrations,
  readMigrations,
  DEFAULT_MIGRATIONS_DIR,
  MIGRATIONS_TABLE,
  type MigrationStatus,
} from "./migrate";
export type { AppendEffects } from "./repos/events";
export { eventFromRow, jsonText, type EventRow } from "./repos/rows";
export type { CreateSessionInput, CreateSessionResult } from "./repos/sessions";
export type { UpdateEntryResult } from "./repos/library";
export type {
  AddVersionResult,
  CreateSavedResult,
  SavedScenarioRecord,
  SavedVersionBody,
  SavedVersionRecord,
} from "./repos/savedScenarios";
export type * from "./types";
export { leaseKey, EVENTS_CHANNEL, SIGNALS_CHANNEL } from "./feed";
export type { ChangeFeed, FeedHandlers } from "./feed";
