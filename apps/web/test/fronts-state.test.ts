// The fronts explorer's address-bar state: a link carries the scenario and the sweep settings
// and reads back the same; anything broken in a link is refused (scenario) or replaced by the
// defaults (sweep settings), never trusted. Demo data are invented.
import { describe, expect, it } from "vitest";
import {
  normalizeFronts,
  solve,
  normalize,
  validateFrontsScenario,
  validateScenario,
} from "@contend/solver";
import type { FrontsScenario } from "@contend/solver";
import { frontsFormToRaw, initialFrontsForm } from "../src/lib/frontsForm";
import { decodeExplorer } from "../src/lib/explorerState";
import {
  decodeFronts,
  defaultSweepSettings,
  encodeFronts,
  frontAsContest,
  frontExplorerLink,
} from "../src/lib/frontsState";
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

describe("a front alone in the single-contest explorer", () => {
  it("frontExplorerLink(an all-pay front without budgets) opens a valid single contest with that front's numbers, whose solve is the mixed all-pay equilibrium", () => {
    const v = validateFrontsScenario({
      title: "Tenders",
      fronts: [
        { name: "Retail", prize: 80, csf: { kind: "ratio", decisiveness: 1 } },
        { name: "City tender", prize: 120, csf: { kind: "allpay" } },
      ],
      rivals: [
        { name: "A", cost: [1, 2] },
        { name: "B", cost: 1, value: [80, 90] },
      ],
    });
    if (!v.ok) throw new Error(v.message);
    const fc = normalizeFronts(v.value);
    const sc = frontAsContest(fc, 1, "EUR");
    expect(validateScenario(sc).ok).toBe(true);
    expect(sc.rivals).toEqual([
      { name: "A", cost: 2, value: 120, weight: 1 },
      { name: "B", cost: 1, value: 90, weight: 1 },
    ]);
    const link = frontExplorerLink(fc, 1, "EUR");
    const back = decodeExplorer(new URL(link, "http://x").searchParams.get("s"));
    expect(back?.sc).toEqual(sc);
    // the single-contest solver's answer for it: mixed (Hillman & Riley 1989; Baye, Kovenock &
    // de Vries 1996), as the note of the fronts solve says
    expect(solve(normalize(sc)).equilibrium.kind).toBe("mixed");
  });
});
