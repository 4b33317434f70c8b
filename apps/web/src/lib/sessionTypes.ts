/** Shapes the web app sends and receives, taken from the protocol package (one source). */
import type { FrontsScenario, Scenario } from "@contend/solver";
import type { SessionSettingsInput } from "@contend/protocol";

/** Body of POST /api/sessions before defaults are applied. */
export type SessionScenarioInput = Scenario & { session?: SessionSettingsInput };

/** Body of POST /api/sessions for a session with fronts (docs/protocol.md R45). */
export type FrontsSessionInput = FrontsScenario & { session?: SessionSettingsInput };
