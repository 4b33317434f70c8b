export { PROTOCOL_VERSION } from "./version";
export { LIMITS } from "./limits";
export { ERROR_CODES, firstProblem, parseInput, parseWith } from "./result";
export { findTextIssue, lineProblem, nameProblem, RESERVED_KEYS, textProblem } from "./text";
export type { TextIssue } from "./text";
export type { ErrorCode, ParseResult } from "./result";
export {
  effortSchema,
  epochMsSchema,
  finiteSchema,
  positiveNumberSchema,
  roundNumberSchema,
  seatIndexSchema,
} from "./numbers";
export {
  contestScenarioSchema,
  csfSpecSchema,
  rivalSpecSchema,
  uncertainScenarioSchema,
} from "./contest";
export { policySpecSchema } from "./policy";
export { sessionSettingsSchema, spendStepOf } from "./settings";
export type { SessionSettings, SessionSettingsInput } from "./settings";
export { isFrontsSession, sessionScenarioSchema } from "./sessionScenario";
export type { AnySessionScenario, SessionScenario } from "./sessionScenario";
export { FRONTS_POLICIES, frontsRoster } from "./frontsSession";
export type { FrontsSessionScenario } from "./frontsSession";
export { frontsRoundSchema, frontsScenarioSchema } from "./frontsRound";
export type { FrontsRound } from "./frontsRound";
export { RIVAL_SHOCK_FIELDS, shockListSchema, shockSchema } from "./shock";
export type { RivalShockField, Shock } from "./shock";
export {
  applyShockSchema,
  claimSeatSchema,
  clientMoveIdSchema,
  closeRoundSchema,
  COMMAND_ROLES,
  commandSchema,
  displayNameSchema,
  endSessionSchema,
  issueLinksSchema,
  openRoundSchema,
  parseCommand,
  pauseSchema,
  resumeSchema,
  roleMaySend,
  sealMoveSchema,
  setSeatPolicySchema,
} from "./commands";
export type { Command, CommandOf, CommandType } from "./commands";
export {
  credentialsSchema,
  helloSchema,
  joinCodeSchema,
  keySchema,
  parseHello,
  ROLES,
  SESSION_ROUTE_PARAM,
  sessionIdSchema,
} from "./hello";
export type { Credentials, Hello, Role } from "./hello";
export { equilibriumSchema } from "./equilibrium";
export {
  CLOSE_REASONS,
  END_REASONS,
  eventBodySchema,
  eventLogSchema,
  initialSeatSchema,
  moveSealedSchema,
  parseEvent,
  pausedSchema,
  resumedSchema,
  roundOpenedSchema,
  roundResolvedSchema,
  seatClaimedSchema,
  seatKindSchema,
  seatPolicySetSchema,
  sessionCreatedSchema,
  sessionEndedSchema,
  sessionEventSchema,
  shockAppliedSchema,
} from "./events";
export type {
  CloseReason,
  EndReason,
  EventBody,
  EventOf,
  EventType,
  InitialSeat,
  RoundResolved,
  SeatKind,
  SessionEvent,
} from "./events";
export {
  roleViewSchema,
  roundResultSchema,
  seatViewSchema,
  SESSION_STATUSES,
  shockRecordSchema,
  viewMessageSchema,
} from "./view";
export type {
  RoleView,
  RoundResult,
  SeatView,
  SessionStatus,
  ShockRecord,
  ViewMessage,
} from "./view";
export { applyPatch, createViewTracker, diffJson, PatchError } from "./viewPatch";
export type { PatchOp, ViewPatchMessage, ViewTracker } from "./viewPatch";
export {
  ackError,
  ackErrorSchema,
  ackSchema,
  basicAckDataSchema,
  claimSeatAckDataSchema,
  helloAckDataSchema,
  issueLinksAckDataSchema,
  sealMoveAckDataSchema,
} from "./ack";
export type {
  Ack,
  AckError,
  BasicAckData,
  ClaimSeatAckData,
  CommandAckData,
  HelloAckData,
  IssueLinksAckData,
  SealMoveAckData,
} from "./ack";
export {
  createSessionResponseSchema,
  errorBodySchema,
  healthSchema,
  readySchema,
  parseSessionScenario,
  sessionExportSchema,
  sessionListItemSchema,
  sessionListSchema,
} from "./rest";
export type {
  CreateSessionResponse,
  ErrorBody,
  Health,
  Ready,
  SessionExport,
  SessionListItem,
} from "./rest";
export type {
  ClientToServerEvents,
  PresenceMessage,
  RevokedMessage,
  ServerToClientEvents,
} from "./socket";
export { attachmentHeader, downloadFileName, fileStem } from "./fileName";
export {
  sessionSummarySchema,
  summaryRoundSchema,
  summarySeatSchema,
  summaryShockSchema,
} from "./summary";
export type { SessionSummaryBody, SummaryRound, SummarySeat, SummaryShock } from "./summary";
export {
  beliefContest,
  fieldOf,
  HIDDEN_FIELDS,
  hiddenEntries,
  hiddenIssue,
  hiddenRangeIssues,
  hiddenSettingsSchema,
  hiddenTruthIssues,
} from "./hidden";
export type { HiddenEntry, HiddenField, HiddenIssue, HiddenSettings } from "./hidden";
export { hiddenRoundViewSchema, hiddenViewSchema } from "./hiddenView";
export type { HiddenRoundView, HiddenView } from "./hiddenView";
export { robustPlanRecordSchema } from "./events";
export type { RobustPlanRecord } from "./events";
export { toCsv } from "./csv";
export type { CsvCell } from "./csv";
export {
  ARCHIVE_FILTERS,
  filterFromQuery,
  libraryNameSchema,
  normaliseTag,
  sessionFilterSchema,
  sessionPatchSchema,
  tagProblem,
  tagSchema,
} from "./library";
export type { SessionFilter, SessionFilterInput, SessionPatch } from "./library";
export {
  MINE_SCENARIOS_MAX,
  mineScenariosBodySchema,
  parseScenarioSave,
  renameScenarioBodySchema,
  saveScenarioBodySchema,
  savedScenarioCreatedSchema,
  savedScenarioListSchema,
  savedScenarioSchema,
  savedVersionInfoSchema,
  savedVersionSchema,
  saveVersionBodySchema,
} from "./savedScenario";
export type {
  SavedScenario,
  SavedScenarioCreated,
  SavedVersion,
  SavedVersionInfo,
  SaveScenarioInput,
} from "./savedScenario";
