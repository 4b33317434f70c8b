import { describe, expect, it } from "vitest";
import {
  decodeExplorer,
  defaultAxis,
  encodeExplorer,
  initialState,
  sweepParams,
} from "../src/lib/explorerState";
import { encodeState } from "../src/lib/urlState";

describe("explorer URL state", () => {
  it("encodeExplorer(state) then decodeExplorer gives the same state", () => {
    const s = initialState();
    const withProfile = { ...s, pf: [3.5, 7] };
    expect(decodeExplorer(encodeExplorer(s))).toEqual(s);
    expect(decodeExplorer(encodeExplorer(withProfile))).toEqual(withProfile);
  });
  it("encodeExplorer(state with ranges) carries the switched-on ranges; decode drops malformed ones", () => {
    const s = initialState();
    const on = { on: true, dist: "triangular", low: "1.5", mode: "2", high: "3" } as const;
    const off = { on: false, dist: "uniform", low: "1", mode: "1", high: "2" } as const;
    const back = decodeExplorer(encodeExplorer({ ...s, rg: { "rivals.1.cost": on, prize: off } }));
    expect(back?.rg).toEqual({ "rivals.1.cost": on });
    const forged = encodeState({
      sc: s.sc,
      sw: s.sw,
      rg: {
        "rivals.1.cost": on,
        "rivals.7.cost": on, // no such rival
        "csf.decisiveness": on, // not a field that takes a range
        prize: { ...on, dist: "normal" },
        "rivals.0.value": { ...on, low: 3 },
      },
    });
    expect(decodeExplorer(forged)?.rg).toEqual({ "rivals.1.cost": on });
  });
  it("decodeExplorer(text) refuses a scenario the solver's validator refuses", () => {
    const bad = encodeState({
      sc: {
        title: "x",
        prize: -1,
        csf: { kind: "ratio", decisiveness: 1 },
        rivals: [{ name: "a", cost: 1 }],
      },
    });
    expect(decodeExplorer(bad)).toBeNull();
    expect(decodeExplorer("not-base64!")).toBeNull();
  });
  it("decodeExplorer(text) keeps the scenario but resets a broken axis and profile", () => {
    const s = initialState();
    const text = encodeState({
      sc: s.sc,
      sw: { param: "rivals.9.cost", from: 1, to: 2, steps: 3 },
      pf: [1],
    });
    const got = decodeExplorer(text);
    expect(got?.sc).toEqual(s.sc);
    expect(got?.sw).toEqual(s.sw);
    expect(got?.pf).toBeNull();
  });
  it("encodeExplorer(state) stays short enough for a link (under 400 characters for two rivals)", () => {
    expect(encodeExplorer(initialState()).length).toBeLessThan(400);
  });
});

describe("sweep axis defaults", () => {
  it("defaultAxis(scenario, rival cost) spans a quarter to four times the current value", () => {
    const s = initialState().sc;
    expect(defaultAxis(s, "rivals.1.cost")).toEqual({
      param: "rivals.1.cost",
      from: 0.5,
      to: 8,
      steps: 61,
    });
  });
  it("defaultAxis(scenario, uncapped budget) runs from zero to twice the prize", () => {
    expect(defaultAxis(initialState().sc, "rivals.0.budget")).toMatchObject({ from: 0, to: 200 });
  });
  it("sweepParams(scenario) lists only the parameters of the chosen contest form", () => {
    const ratio = sweepParams(initialState().sc).map((p) => p.path);
    expect(ratio).toContain("csf.decisiveness");
    expect(ratio).not.toContain("csf.scale");
    const logit = sweepParams({ ...initialState().sc, csf: { kind: "logit", scale: 0.1 } }).map(
      (p) => p.path,
    );
    expect(logit).toContain("csf.scale");
    expect(logit).not.toContain("rivals.0.decisiveness");
  });
});
