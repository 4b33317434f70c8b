/** Shapes the web app sends and receives, taken from the protocol package (one source). */
import type { Scenario } from "@contend/solver";
import type { SessionSettingsInput } from "@contend/protocol";

/** Body of POST /api/sessions before defaults are applied. */
export type SessionScenarioInput = Scenario & { session?: SessionSettingsInput };
