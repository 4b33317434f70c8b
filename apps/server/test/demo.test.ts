// The first-start demo reads the solver's example scenario through the solver's package exports
// (not a relative path into its folder) and must stay a valid session scenario.
import { existsSync } from "node:fs";
import { parseSessionScenario } from "@contend/protocol";
import { describe, expect, it } from "vitest";
import { DEMO_SCENARIO_FILE, demoScenario } from "../src/demo";

describe("demo scenario", () => {
  it("resolves @contend/solver/scenarios/kiosk-lease.json to a file that exists", () => {
    expect(DEMO_SCENARIO_FILE).toMatch(/[\\/]scenarios[\\/]kiosk-lease\.json$/);
    expect(existsSync(DEMO_SCENARIO_FILE)).toBe(true);
  });

  it("is a valid session scenario with its last rival played by the computer", () => {
    const parsed = parseSessionScenario(demoScenario());
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const last = parsed.value.rivals[parsed.value.rivals.length - 1]!.name;
    expect(Object.keys(parsed.value.session.computer ?? {})).toEqual([last]);
  });
});
