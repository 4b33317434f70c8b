import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import {
  bindField,
  blankRival,
  defaultForm,
  formToContestRaw,
  formToScenario,
  keptPolicyFields,
  parseNumberField,
  rivalFieldError,
} from "../src/lib/editorForm";
import { parseScenarioText, scenarioToForm } from "../src/lib/editorImport";
import {
  privateFieldError,
  privateKey,
  privatePoint,
  privateRangesByPath,
} from "../src/lib/privateForm";
import { decodeExplorer } from "../src/lib/explorerState";
import { encodeState } from "../src/lib/urlState";
import { plainErrors } from "../src/lib/plainErrors";
import { parseSessionScenario } from "@contend/protocol";
import type { EditorForm } from "../src/lib/editorForm";
import type { SessionScenarioInput } from "../src/lib/sessionTypes";
import { TEMPLATES } from "../src/lib/templates";

function withRival(
  form: EditorForm,
  i: number,
  patch: Partial<EditorForm["rivals"][number]>,
): EditorForm {
  return { ...form, rivals: form.rivals.map((r, k) => (k === i ? { ...r, ...patch } : r)) };
}

describe("bindField", () => {
  it("bindField(form, setForm, key) reads that field and writes only that field", () => {
    let form: EditorForm = defaultForm();
    const setForm = (update: (f: EditorForm) => EditorForm) => {
      form = update(form);
    };
    const before = form;
    const rounds = bindField(form, setForm, "rounds");
    expect(rounds.value).toBe(before.rounds);
    rounds.onChange("7");
    expect(form).toEqual({ ...before, rounds: "7" });
    bindField(form, setForm, "missingMove").onChange("repeat");
    expect(form).toEqual({ ...before, rounds: "7", missingMove: "repeat" });
  });
});

describe("parseNumberField", () => {
  it("parseNumberField(text) gives numbers, undefined for blank, and passes bad text through", () => {
    expect(parseNumberField(" 12.5 ")).toBe(12.5);
    expect(parseNumberField("1,200")).toBe(1200);
    expect(parseNumberField("")).toBeUndefined();
    expect(parseNumberField("twelve")).toBe("twelve");
  });
});

describe("formToScenario", () => {
  it("formToScenario(defaultForm()) is a valid session scenario with numeric fields", () => {
    const r = formToScenario(defaultForm());
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.scenario.prize).toBe(100);
    expect(r.scenario.rivals.map((x) => x.cost)).toEqual([1, 1]);
    expect(r.scenario.session).toMatchObject({
      spendStep: 1,
      rounds: 5,
      clockSeconds: null,
      computer: {},
    });
  });

  it("formToScenario(form) reports every bad field at once, each at its validator path", () => {
    let form = { ...defaultForm(), prize: "-5", rounds: "0" };
    form = withRival(form, 1, { cost: "abc", weight: "0" });
    const r = formToScenario(form);
    expect(r.ok).toBe(false);
    expect(r.errors.prize).toMatch(/> 0/);
    expect(r.errors["rivals.1.cost"]).toMatch(/finite number/);
    expect(r.errors["rivals.1.weight"]).toMatch(/> 0/);
    expect(r.errors["session.rounds"]).toMatch(/>= 1/);
    expect(rivalFieldError(r.errors, form, 1, "cost")).toBe(r.errors["rivals.1.cost"]);
    expect(rivalFieldError(r.errors, form, 0, "cost")).toBeUndefined();
  });

  it("formToScenario(form) flags a duplicated rival name on the second row", () => {
    const form = withRival(defaultForm(), 1, { name: "Rival 1" });
    const r = formToScenario(form);
    expect(r.ok).toBe(false);
    expect(r.errors["rivals.1.name"]).toMatch(/duplicates/);
  });

  it("formToScenario(form) maps a blank clock to null and a too-short clock to its field", () => {
    expect(formToScenario({ ...defaultForm(), clockSeconds: "" }).ok).toBe(true);
    const r = formToScenario({ ...defaultForm(), clockSeconds: "2" });
    expect(r.errors["session.clockSeconds"]).toMatch(/>= 5/);
  });

  it("formToScenario(form) keys computer policies by rival name and reports a bad factor on that row", () => {
    const ok = formToScenario(withRival(defaultForm(), 0, { policy: "equilibrium" }));
    expect(ok.ok && ok.scenario.session?.computer).toEqual({ "Rival 1": { kind: "equilibrium" } });
    const form = withRival(defaultForm(), 1, { policy: "overspender", policyArg: "0" });
    const bad = formToScenario(form);
    expect(bad.ok).toBe(false);
    expect(rivalFieldError(bad.errors, form, 1, "policyArg")).toMatch(/>\s?0/);
  });

  it("formToScenario(form) refuses a one-rival live session (seat count rule of the protocol)", () => {
    const form = { ...defaultForm(), rivals: defaultForm().rivals.slice(0, 1) };
    const r = formToScenario(form);
    expect(r.ok).toBe(false);
    expect(r.errors.rivals).toMatch(/2 to/);
  });

  it("scenarioToForm(template) then formToScenario gives the template back for every template", () => {
    for (const t of TEMPLATES) {
      const r = formToScenario(scenarioToForm(t.scenario));
      expect(r.ok, t.id).toBe(true);
      if (!r.ok) continue;
      expect(r.scenario.rivals).toEqual(t.scenario.rivals);
      expect(r.scenario.csf).toEqual(t.scenario.csf);
      expect(r.scenario.prize).toBe(t.scenario.prize);
      expect(r.scenario.session).toEqual(t.scenario.session);
    }
  });
});

describe("computer policy settings without a field", () => {
  const imported = {
    ...TEMPLATES[0]!.scenario,
    session: {
      ...TEMPLATES[0]!.scenario.session,
      computer: {
        [TEMPLATES[0]!.scenario.rivals[0]!.name]: {
          kind: "overspender",
          factor: 1.4,
          noise: 0.1,
          decay: 0.8,
        },
      },
    },
  } as SessionScenarioInput;

  it("an imported overspender keeps its noise and decay through the form", () => {
    const r = formToScenario(scenarioToForm(imported));
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.scenario.session).toEqual(imported.session);
  });

  it("kept settings apply only while the same policy is chosen", () => {
    const form = scenarioToForm(imported);
    expect(keptPolicyFields(form.rivals[0]!)).toEqual([
      ["noise", 0.1],
      ["decay", 0.8],
    ]);
    const fixed = withRival(form, 0, { policy: "fixed", policyArg: "3" });
    expect(keptPolicyFields(fixed.rivals[0]!)).toEqual([]);
    const r = formToScenario(fixed);
    expect(r.ok).toBe(true);
    if (r.ok)
      expect(r.scenario.session?.computer?.[imported.rivals[0]!.name]).toEqual({
        kind: "fixed",
        spend: 3,
      });
  });
});

describe("parseScenarioText", () => {
  it("parseScenarioText(CLI file) imports a scenario file the contend CLI reads", () => {
    const path = fileURLToPath(
      new URL("../../../packages/solver/scenarios/kiosk-lease.json", import.meta.url),
    );
    const r = parseScenarioText(readFileSync(path, "utf8"));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.form.rivals.map((x) => x.name)).toEqual([
      "Larkspur Bakehouse",
      "Millstone Loaves",
      "Hearth Lane Bakery",
    ]);
    expect(r.form.rivals[1]?.cost).toBe("1.25");
  });
  it("parseScenarioText(bad) explains the problem with its path", () => {
    expect(parseScenarioText("{").ok).toBe(false);
    const r = parseScenarioText(
      JSON.stringify({
        title: "x",
        prize: 1,
        csf: { kind: "ratio", decisiveness: 1 },
        rivals: [{ name: "a", cost: -1 }],
      }),
    );
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems).toEqual(["Rival 1 cost: must be above 0 (you entered -1)."]);
  });
  it("parseScenarioText(several bad fields) lists every problem at once", () => {
    const r = parseScenarioText(
      JSON.stringify({
        title: "",
        prize: -5,
        csf: { kind: "ratio", decisiveness: 1 },
        rivals: [
          { name: "a", cost: "cheap" },
          { name: "b", cost: 1 },
        ],
        session: { rounds: 2.5 },
      }),
    );
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toEqual([
      "Title: cannot be empty.",
      "Prize: must be above 0 (you entered -5).",
      'Rival 1 cost: enter a number above 0 (you entered "cheap").',
      "Rounds: enter a whole number.",
    ]);
  });
});

describe("private numbers from a loaded file (docs/protocol.md R40)", () => {
  const file = {
    title: "Kiosk",
    prize: 100,
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: [
      { name: "North Bakery", cost: 1 },
      { name: "Corner Ovens", cost: 2 },
    ],
    session: {
      hidden: {
        truth: "draw",
        rivals: { "Corner Ovens": { cost: { dist: "uniform", low: 1.5, high: 3 } } },
      },
    },
  };

  it("survive the form and reach the session scenario; clearing them makes every number public", () => {
    const loaded = parseScenarioText(JSON.stringify(file));
    expect(loaded.ok).toBe(true);
    if (!loaded.ok) return;
    const r = formToScenario(loaded.form);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.scenario.session?.hidden).toEqual(file.session.hidden);
    const cleared = formToScenario({ ...loaded.form, privateRanges: {} });
    expect(cleared.ok && cleared.scenario.session?.hidden).toBeUndefined();
  });
});

describe("private numbers set in the editor (docs/protocol.md R40)", () => {
  function twoRivals(): EditorForm {
    const f = defaultForm();
    f.rivals[0]!.name = "North Bakery";
    f.rivals[1]!.name = "Corner Ovens";
    f.rivals[1]!.cost = "2";
    return f;
  }
  const range = (low: string, high: string, mode = "") => ({
    on: true,
    dist: mode === "" ? ("uniform" as const) : ("triangular" as const),
    low,
    mode,
    high,
  });

  it("a switched-on cost range becomes session.hidden, which the protocol's schema accepts", () => {
    const f = twoRivals();
    const key = privateKey(f.rivals[1]!.key, "cost");
    const r = formToScenario({ ...f, privateRanges: { [key]: range("1.5", "3") } });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.scenario.session?.hidden).toEqual({
      truth: "draw",
      rivals: { "Corner Ovens": { cost: { dist: "uniform", low: 1.5, high: 3 } } },
    });
    // the server's own parser reads the same scenario
    expect(parseSessionScenario(r.scenario).ok).toBe(true);
  });

  it("a switched-off range and an empty map leave every number public", () => {
    const f = twoRivals();
    const key = privateKey(f.rivals[1]!.key, "cost");
    const r = formToScenario({ ...f, privateRanges: { [key]: { ...range("1", "3"), on: false } } });
    expect(r.ok && r.scenario.session?.hidden).toBeUndefined();
  });

  it("each bad range is named at its own field, all at once, in plain words", () => {
    const f = twoRivals();
    const r = formToScenario({
      ...f,
      privateRanges: {
        [privateKey(f.rivals[1]!.key, "cost")]: range("3", "1"),
        [privateKey(f.rivals[0]!.key, "value")]: range("80", "120", "200"),
      },
    });
    expect(r.ok).toBe(false);
    const plain = plainErrors(r.errors);
    expect(privateFieldError(r.errors, "Corner Ovens", "cost")).toMatch(/must be >= low/);
    expect(privateFieldError(r.errors, "North Bakery", "value")).toMatch(/must be >= mode/);
    expect(plain["session.hidden.rivals.Corner Ovens.cost.high"]).toMatch(
      /^Private cost range of Corner Ovens, high: /,
    );
    // positive control: the other field of the same rival has no error
    expect(privateFieldError(r.errors, "Corner Ovens", "value")).toBeUndefined();
  });

  it('truth "table": a true number outside its range is reported at that number', () => {
    const f = twoRivals();
    const key = privateKey(f.rivals[1]!.key, "cost");
    const outside = formToScenario({
      ...f,
      truth: "scenario",
      privateRanges: { [key]: range("3", "4") },
    });
    expect(outside.ok).toBe(false);
    if (outside.ok) return;
    expect(rivalFieldError(outside.errors, f, 1, "cost")).toMatch(/outside its private range/);
    const inside = formToScenario({
      ...f,
      truth: "scenario",
      privateRanges: { [key]: range("1", "4") },
    });
    expect(inside.ok).toBe(true);
  });

  it("a range stays with its rival when the rival is renamed or another is removed", () => {
    const f = twoRivals();
    const key = privateKey(f.rivals[1]!.key, "cost");
    const renamed = {
      ...f,
      privateRanges: { [key]: range("1", "3") },
      rivals: [f.rivals[0]!, { ...f.rivals[1]!, name: "Oven Row" }, blankRival(2)],
    };
    const r = formToScenario(renamed);
    expect(r.ok && Object.keys(r.scenario.session?.hidden?.rivals ?? {})).toEqual(["Oven Row"]);
    const removed = formToScenario({
      ...renamed,
      rivals: renamed.rivals.filter((_, i) => i !== 0),
    });
    expect(removed.ok && Object.keys(removed.scenario.session?.hidden?.rivals ?? {})).toEqual([
      "Oven Row",
    ]);
  });

  it("a file's private numbers load into the switches and come back unchanged (triangular too)", () => {
    const hidden = {
      truth: "scenario" as const,
      rivals: {
        "Corner Ovens": {
          cost: { dist: "triangular" as const, low: 1.5, mode: 2, high: 3 },
          value: { dist: "uniform" as const, low: 80, high: 120 },
        },
      },
    };
    const s = scenarioToForm({
      title: "Kiosk",
      prize: 100,
      csf: { kind: "ratio", decisiveness: 1 },
      rivals: [
        { name: "North Bakery", cost: 1 },
        { name: "Corner Ovens", cost: 2, value: 100 },
      ],
      session: { hidden },
    } as SessionScenarioInput);
    expect(s.truth).toBe("scenario");
    expect(s.privateRanges[privateKey(s.rivals[1]!.key, "cost")]).toMatchObject({
      on: true,
      dist: "triangular",
      mode: "2",
    });
    const r = formToScenario(s);
    expect(r.ok && r.scenario.session?.hidden).toEqual(hidden);
  });

  it("an imported file whose private numbers name no rival is refused with that name", () => {
    const r = parseScenarioText(
      JSON.stringify({
        title: "Kiosk",
        prize: 100,
        csf: { kind: "ratio", decisiveness: 1 },
        rivals: [
          { name: "North Bakery", cost: 1 },
          { name: "Corner Ovens", cost: 2 },
        ],
        session: { hidden: { rivals: { Nobody: { cost: { dist: "uniform", low: 1, high: 2 } } } } },
      }),
    );
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/Nobody/);
  });

  it("privatePoint: a range starts around the field's number, a blank value around the prize", () => {
    expect(privatePoint("2.5", "cost", 100)).toBe(2.5);
    expect(privatePoint("", "value", 100)).toBe(100);
    expect(privatePoint("abc", "cost", 100)).toBe(1);
  });

  it("the explorer link from the editor carries the private ranges, and the explorer reads them back", () => {
    const f = twoRivals();
    const on = range("1.5", "3");
    const privateRanges = {
      [privateKey(f.rivals[1]!.key, "cost")]: on,
      [privateKey(f.rivals[0]!.key, "value")]: { ...range("80", "120"), on: false },
    };
    const rg = privateRangesByPath(f.rivals, privateRanges);
    expect(rg).toEqual({ "rivals.1.cost": on });
    const back = decodeExplorer(encodeState({ sc: formToContestRaw(f), rg }));
    expect(back?.rg).toEqual({ "rivals.1.cost": on });
  });
});
