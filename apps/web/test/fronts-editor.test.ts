// The session editor's "several fronts" mode: form -> POST /api/sessions body and back. The
// rule book is the solver's validateFrontsScenario and the protocol's session parser (the one
// the server runs); these tests check that the form sends what they accept, that every problem
// lands at its own field with their message, and that the numbers land where the model reads
// them (checked against Tullock's symmetric equilibrium). Demo data are invented.
import { describe, expect, it } from "vitest";
import { normalizeFronts, solveFronts, validateFrontsScenario } from "@contend/solver";
import { frontsRoster, parseSessionScenario } from "@contend/protocol";
import { computerError, defaultForm } from "../src/lib/editorForm";
import type { EditorForm } from "../src/lib/editorForm";
import {
  FRONTS_POLICY_CHOICES,
  frontsFromSingle,
  frontsSessionToForms,
  frontsToSession,
} from "../src/lib/frontsEditor";
import type { FrontsForm } from "../src/lib/frontsForm";
import { FRONTS_TEMPLATES } from "../src/lib/frontsTemplates";
import { plainErrors } from "../src/lib/plainErrors";

/** Two districts, three invented bakeries, one played by the computer, a 90-second clock. */
function editor(): EditorForm {
  return {
    ...defaultForm(),
    title: "Three bakeries over two districts",
    currency: "EUR",
    rounds: "3",
    clockSeconds: "90",
    missingMove: "repeat",
  };
}
function twoFronts(): FrontsForm {
  const rival = (name: string, budget: string, policy?: "equilibrium") => ({
    name,
    budget,
    sunk: false,
    cost: ["1", "2"],
    value: ["", ""],
    weight: ["", ""],
    ...(policy ? { policy } : {}),
  });
  return {
    title: "ignored: the editor's title wins",
    currency: "ignored",
    fronts: [
      { name: "North", prize: "9000", kind: "ratio", param: "1" },
      { name: "South", prize: "4500", kind: "ratio", param: "1" },
    ],
    rivals: [rival("Crumb Co", "", "equilibrium"), rival("Loaf Lane", ""), rival("Rye Works", "")],
  };
}

describe("frontsToSession", () => {
  it("a 2-front, 3-rival form with one computer seat and a clock is a body the server's parser accepts", () => {
    const r = frontsToSession(editor(), twoFronts());
    expect(r.errors).toEqual({});
    if (!r.ok) throw new Error("refused");
    expect(r.scenario.title).toBe("Three bakeries over two districts");
    expect(r.scenario.currency).toBe("EUR");
    expect(r.scenario.fronts.map((f) => [f.name, f.prize])).toEqual([
      ["North", 9000],
      ["South", 4500],
    ]);
    expect(r.scenario.session).toEqual({
      outcome: "shares",
      rounds: 3,
      clockSeconds: 90,
      missingMove: "repeat",
      computer: { "Crumb Co": { kind: "equilibrium" } },
    });
    const parsed = parseSessionScenario(r.scenario);
    expect(parsed.ok).toBe(true);
    if (!parsed.ok || !("fronts" in parsed.value)) throw new Error("not a fronts session");
    // the roster the seats are named from: prize = the sum of the fronts' prizes (R45)
    expect(frontsRoster(parsed.value).prize).toBe(13500);
    expect(parsed.value.session.clockSeconds).toBe(90);
  });

  it("the numbers land where the model reads them: without budgets each front has Tullock's symmetric spend V(n-1)/n^2", () => {
    // Tullock (1980), ratio form r = 1, n identical rivals: effort x = V(n-1)/(n^2 c), so the
    // money spent, c x, is V(n-1)/n^2 whatever the cost: 2000 on North, 1000 on South for n = 3.
    const r = frontsToSession(editor(), twoFronts());
    if (!r.ok) throw new Error("refused");
    const { equilibrium } = solveFronts(normalizeFronts(r.scenario));
    expect(equilibrium.kind).toBe("pure");
    for (const row of equilibrium.spends!) {
      expect(row[0]).toBeCloseTo((9000 * 2) / 9, 3);
      expect(row[1]).toBeCloseTo((4500 * 2) / 9, 3);
    }
  });

  it("budgets are money over all fronts: a budget below the unconstrained spend binds", () => {
    const f = twoFronts();
    f.rivals[1]!.budget = "1500";
    const r = frontsToSession(editor(), f);
    if (!r.ok) throw new Error("refused");
    expect(r.scenario.rivals[1]!.budget).toBe(1500);
    const { equilibrium } = solveFronts(normalizeFronts(r.scenario));
    const used = equilibrium.spends![1]!.reduce((a, b) => a + b, 0);
    expect(used).toBeLessThanOrEqual(1500 + 1e-6);
    expect(used).toBeGreaterThan(1500 - 1e-3);
  });

  it("every problem shows at its own field at once, with the validator's own message", () => {
    const f = twoFronts();
    f.fronts[0]!.prize = "-5";
    f.rivals[1]!.cost[1] = "abc";
    f.rivals[2]!.budget = "lots";
    const form = { ...editor(), rounds: "0", clockSeconds: "2" };
    const r = frontsToSession(form, f);
    expect(r.ok).toBe(false);
    expect(Object.keys(r.errors).sort()).toEqual([
      "fronts.0.prize",
      "rivals.1.cost.1",
      "rivals.2.budget",
      "session.clockSeconds",
      "session.rounds",
    ]);
    // the message at each field is what the solver says when that is the only problem
    const only = twoFronts();
    only.rivals[1]!.cost[1] = "abc";
    const alone = frontsToSession(editor(), only);
    const direct = validateFrontsScenario({
      title: "x",
      fronts: [{ name: "A", prize: 1, csf: { kind: "ratio", decisiveness: 1 } }],
      rivals: [{ name: "B", cost: ["abc"] }],
    });
    expect(direct.ok).toBe(false);
    if (direct.ok) return;
    expect(alone.errors["rivals.1.cost.1"]).toBe(direct.message);
    const plain = plainErrors(r.errors);
    expect(plain["fronts.0.prize"]).toMatch(/^Front 1 prize: /);
    expect(plain["rivals.1.cost.1"]).toMatch(/^Rival 2 cost on front 2: /);
  });

  it("the live-session rules come from the protocol: seat count at `rivals`, fronts-only computer kinds at the seat", () => {
    const one = twoFronts();
    one.rivals = one.rivals.slice(0, 1);
    const r1 = frontsToSession(editor(), one);
    expect(r1.errors.rivals).toMatch(/a live session needs 2 to \d+ rivals \(got 1\)/);

    const fixed = twoFronts();
    fixed.rivals[2]!.policy = "fictitious-play";
    const r2 = frontsToSession(editor(), fixed);
    expect(r2.errors["session.computer.Rye Works.kind"]).toMatch(/^R49: /);
    expect(computerError(r2.errors, "Rye Works ")).toMatch(/^R49: /);
    expect(computerError(r2.errors, "Loaf Lane")).toBeUndefined();
  });

  it("offers only the players fronts accept: a person, equilibrium and best reply", () => {
    expect(FRONTS_POLICY_CHOICES.map((c) => c.value)).toEqual([
      "human",
      "equilibrium",
      "best-reply",
    ]);
  });

  it("sends nothing a fronts session refuses, whatever the single-contest fields hold", () => {
    const form: EditorForm = { ...editor(), outcome: "winner", spendStep: "250" };
    const r = frontsToSession(form, twoFronts());
    if (!r.ok) throw new Error("refused");
    expect(r.scenario.session?.outcome).toBe("shares");
    expect(r.scenario.session).not.toHaveProperty("hidden");
    expect(r.scenario.session).not.toHaveProperty("spendStep");
  });
});

describe("fronts session <-> editor forms", () => {
  it("the fronts template round-trips through the editor unchanged", () => {
    const t = FRONTS_TEMPLATES[0]!;
    const forms = frontsSessionToForms(t.scenario, defaultForm());
    if (!forms) throw new Error("template not read");
    const r = frontsToSession(forms.form, forms.fronts);
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    const { session, ...scenario } = t.scenario;
    const again = validateFrontsScenario(scenario);
    if (!again.ok) throw new Error(again.message);
    expect(normalizeFronts(r.scenario)).toEqual(normalizeFronts(again.value));
    expect(r.scenario.session).toEqual({ outcome: "shares", ...session });
  });

  it("a single-contest body is not read as fronts", () => {
    expect(frontsSessionToForms({ title: "x", prize: 1, rivals: [] }, defaultForm())).toBeNull();
  });

  it("frontsFromSingle keeps the rivals, their costs and budgets, and the computer seats fronts take", () => {
    const form = defaultForm();
    form.rivals[0] = {
      ...form.rivals[0]!,
      name: "Alder",
      cost: "2",
      budget: "40",
      policy: "equilibrium",
    };
    form.rivals[1] = { ...form.rivals[1]!, name: "Birch", policy: "fixed", policyArg: "5" };
    const f = frontsFromSingle(form);
    expect(f.fronts).toHaveLength(2);
    expect(f.rivals.map((r) => [r.name, r.budget, r.cost, r.policy])).toEqual([
      ["Alder", "40", ["2", "2"], "equilibrium"],
      ["Birch", "", ["1", "1"], undefined],
    ]);
    expect(frontsToSession(form, f).ok).toBe(true);
  });
});
