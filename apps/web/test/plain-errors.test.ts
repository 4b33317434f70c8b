import { describe, expect, it } from "vitest";
import { validateScenario } from "@contend/solver";
import { fieldName, plainError } from "../src/lib/plainErrors";

/** The solver validator's own message for a scenario with one bad field. */
function messageFor(patch: Record<string, unknown>, rival?: Record<string, unknown>) {
  const r = validateScenario({
    title: "T",
    prize: 100,
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: [
      { name: "A", cost: 1, ...rival },
      { name: "B", cost: 1 },
    ],
    ...patch,
  });
  if (r.ok) throw new Error("expected a refusal");
  return { path: r.path, message: r.message };
}

describe("plain error messages", () => {
  it("name the field the way the form labels it", () => {
    expect(fieldName("rivals.1.cost")).toBe("Rival 2 cost");
    expect(fieldName("session.rounds")).toBe("Rounds");
    expect(fieldName("title")).toBe("Title");
  });

  it("reword the validator's messages without developer notation", () => {
    const empty = messageFor({ title: "" });
    expect(plainError(empty.path, empty.message)).toBe("Title: cannot be empty.");
    const negative = messageFor({}, { cost: -2 });
    expect(plainError(negative.path, negative.message)).toBe(
      "Rival 1 cost: must be above 0 (you entered -2).",
    );
    const text = messageFor({}, { cost: "cheap" });
    expect(plainError(text.path, text.message)).toBe(
      'Rival 1 cost: enter a number above 0 (you entered "cheap").',
    );
    for (const m of [empty, negative, text]) {
      expect(plainError(m.path, m.message)).not.toMatch(/non-empty string|finite|got |[<>]=?/);
    }
  });
});
