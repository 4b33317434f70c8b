import { readFileSync, readdirSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { isFrontsInput, validateFrontsScenario } from "../src/fronts/validateFronts";
import { validateScenario } from "../src/validate";

const base = () => ({
  title: "Three bakeries",
  prize: 100,
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "A", cost: 1 },
    { name: "B", cost: 2, value: 80, weight: 1.5, budget: 40, decisiveness: 0.8 },
  ],
  leader: null,
  currency: "EUR",
});

// Test inputs are deliberately malformed, so they are loosely typed.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Loose = any;
type Mutate = (s: Loose) => unknown;

function errorOf(mutate: Mutate) {
  const s: Loose = base();
  const input = mutate(s) ?? s;
  const r = validateScenario(input);
  if (r.ok) throw new Error("expected a validation error");
  return r;
}

describe("validateScenario", () => {
  it("validateScenario(valid scenario) returns a typed copy", () => {
    const r = validateScenario(base());
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.rivals[1]).toEqual({
      name: "B",
      cost: 2,
      value: 80,
      weight: 1.5,
      budget: 40,
      decisiveness: 0.8,
    });
    expect(r.value.currency).toBe("EUR");
    expect(r.value.leader).toBeNull();
  });

  it("validateScenario(bundled demo scenarios) accepts every file in scenarios/ (fronts files by validateFrontsScenario)", () => {
    const dir = fileURLToPath(new URL("../scenarios/", import.meta.url));
    const files = readdirSync(dir).filter((f) => f.endsWith(".json"));
    expect(files.length).toBeGreaterThanOrEqual(3);
    for (const f of files) {
      const json: unknown = JSON.parse(readFileSync(dir + f, "utf8"));
      const r = isFrontsInput(json) ? validateFrontsScenario(json) : validateScenario(json);
      expect(r.ok ? "ok" : `${f}: ${r.path} ${r.message}`).toBe("ok");
    }
  });

  it("validateScenario(null fields) treats null as the default", () => {
    const r = validateScenario({
      ...base(),
      rivals: [{ name: "A", cost: 1, value: null, weight: null, budget: null, decisiveness: null }],
    });
    expect(r.ok).toBe(true);
  });

  it("validateScenario(logit and all-pay) accepts their own parameters only", () => {
    expect(validateScenario({ ...base(), csf: { kind: "logit", scale: 0.1 } }).ok).toBe(true);
    expect(validateScenario({ ...base(), csf: { kind: "allpay" } }).ok).toBe(true);
  });

  const cases: [string, Mutate, string, RegExp][] = [
    ["non-object root", () => [1, 2], "", /JSON object/],
    ["unknown top-level field", (s) => void (s.extra = 1), "extra", /unknown field "extra"/],
    [
      "missing title",
      (s) => void delete (s as Record<string, unknown>).title,
      "title",
      /non-empty/,
    ],
    ["overlong title", (s) => void (s.title = "x".repeat(201)), "title", /200/],
    ["zero prize", (s) => void (s.prize = 0), "prize", /> 0/],
    ["non-finite prize", (s) => void (s.prize = Infinity), "prize", /finite/],
    ["string prize", (s) => void (s.prize = "100"), "prize", /finite number/],
    ["unknown csf kind", (s) => void (s.csf = { kind: "lottery" }), "csf.kind", /ratio/],
    ["csf not an object", (s) => void (s.csf = "ratio"), "csf", /object/],
    ["decisiveness 0", (s) => void (s.csf.decisiveness = 0), "csf.decisiveness", /> 0/],
    ["decisiveness 21", (s) => void (s.csf.decisiveness = 21), "csf.decisiveness", /<= 20/],
    [
      "field of another form",
      (s) => void (s.csf = { kind: "ratio", decisiveness: 1, scale: 2 } as never),
      "csf.scale",
      /unknown field/,
    ],
    [
      "logit scale <= 0",
      (s) => void (s.csf = { kind: "logit", scale: -1 } as never),
      "csf.scale",
      /> 0/,
    ],
    ["rivals not array", (s) => void (s.rivals = {} as never), "rivals", /array/],
    ["no rivals", (s) => void (s.rivals = []), "rivals", /1 to 10000/],
    [
      "too many rivals",
      (s) =>
        void (s.rivals = Array.from({ length: 10_001 }, (_, i) => ({ name: `R${i}`, cost: 1 }))),
      "rivals",
      /10000/,
    ],
    ["rival not object", (s) => void (s.rivals[1] = 3 as never), "rivals.1", /object/],
    [
      "unknown rival field",
      (s) => void ((s.rivals[0] as Record<string, unknown>).colour = "red"),
      "rivals.0.colour",
      /unknown field "colour"/,
    ],
    ["empty name", (s) => void (s.rivals[0]!.name = " "), "rivals.0.name", /non-empty/],
    ["long name", (s) => void (s.rivals[0]!.name = "n".repeat(81)), "rivals.0.name", /80/],
    ["duplicate name", (s) => void (s.rivals[1]!.name = "A"), "rivals.1.name", /duplicates/],
    ["negative cost", (s) => void (s.rivals[1]!.cost = -3), "rivals.1.cost", /> 0/],
    ["NaN cost", (s) => void (s.rivals[1]!.cost = NaN), "rivals.1.cost", /finite/],
    [
      "missing cost",
      (s) => void delete (s.rivals[0] as Record<string, unknown>).cost,
      "rivals.0.cost",
      /finite/,
    ],
    ["zero value", (s) => void (s.rivals[1]!.value = 0), "rivals.1.value", /> 0/],
    ["negative weight", (s) => void (s.rivals[1]!.weight = -1), "rivals.1.weight", /> 0/],
    ["budget < 0", (s) => void (s.rivals[1]!.budget = -0.5), "rivals.1.budget", />= 0/],
    [
      "rival decisiveness 25",
      (s) => void (s.rivals[1]!.decisiveness = 25),
      "rivals.1.decisiveness",
      /<= 20/,
    ],
    [
      "unknown leader",
      (s) => void (s.leader = "Z" as never),
      "leader",
      /name of one of the rivals/,
    ],
    ["long currency", (s) => void (s.currency = "DOUBLOONS"), "currency", /8/],
  ];

  for (const [label, mutate, path, message] of cases) {
    it(`validateScenario(${label}) names ${path || "the root"}`, () => {
      const err = errorOf(mutate);
      expect(err.path).toBe(path);
      expect(err.message).toMatch(message);
      expect(err.message).not.toContain("\n");
    });
  }

  it("validateScenario(zero budget) is allowed: a rival may be unable to spend", () => {
    const s = base();
    s.rivals[1]!.budget = 0;
    expect(validateScenario(s).ok).toBe(true);
  });
});
