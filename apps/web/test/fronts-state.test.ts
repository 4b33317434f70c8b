// The fronts explorer's address-bar state: a link carries the scenario and the sweep settings
// and reads back the same; anything broken in a link is refused (scenario) or replaced by the
// defaults (sweep settings), never trusted. Demo data are invented.
import { describe, expect, it } from "vitest";
import { validateFrontsScenario } from "@contend/solver";
import type { FrontsScenario } from "@contend/solver";
import { frontsFormToRaw, initialFrontsForm } from "../src/lib/frontsForm";
import { decodeFronts, defaultSweepSettings, encodeFronts } from "../src/lib/frontsState";
import { encodeState } from "../src/lib/urlState";

function scenario(): FrontsScenario {
  const v = validateFrontsScenario(frontsFormToRaw(initialFrontsForm()));
  if (!v.ok) throw new Error(v.message);
  return v.value;
}

describe("fronts link state", () => {
  it("decodeFronts(encodeFronts(state)) gives back the scenario and the sweep settings", () => {
    const sc = scenario();
    sc.fronts[1] = { name: "Tender", prize: 5000, csf: { kind: "allpay" } };
    const sw = { param: "rivals.1.budget", from: "100", to: "9000", steps: "41", metric: "shadow" };
    const back = decodeFronts(encodeFronts({ sc, sw }));
    expect(back).toEqual({ sc, sw });
  });

  it("a link whose scenario does not validate is refused (null)", () => {
    const sc = scenario() as unknown as Record<string, unknown>;
    expect(decodeFronts(encodeState({ sc: { ...sc, fronts: [] } }))).toBeNull();
    expect(decodeFronts("not base64 !")).toBeNull();
    expect(decodeFronts(null)).toBeNull();
  });

  it("sweep settings that do not fit the scenario fall back to the defaults, field by field", () => {
    const sc = scenario();
    const base = defaultSweepSettings(sc);
    const back = decodeFronts(
      encodeState({
        sc,
        sw: { param: "fronts.9.prize", from: "x".repeat(41), to: "5", steps: 3, metric: "front:7" },
      }),
    );
    expect(back?.sw).toEqual({ ...base, to: "5" });
  });
});
