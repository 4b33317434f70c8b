// The explorer's equilibrium is solved in a Web Worker: the answer crosses postMessage (the
// structured clone algorithm, HTML Living Standard §2.7) and must arrive unchanged, and the
// last answer stays on screen while a newer scenario is solved.
import { describe, expect, it } from "vitest";
import type { Scenario } from "@contend/solver";
import { shownAnswer, startSolving } from "../src/lib/solveState";
import type { SolveState } from "../src/lib/solveState";
import { answerForView, solveForView } from "../src/lib/solveView";

/** Three rivals at decisiveness 3: no pure equilibrium (Baye, Kovenock & de Vries 1994). */
const mixedThree: Scenario = {
  title: "Three rivals, decisive contest",
  prize: 100,
  currency: "$",
  csf: { kind: "ratio", decisiveness: 3 },
  rivals: [
    { name: "North", cost: 1 },
    { name: "South", cost: 1.5 },
    { name: "Harbour", cost: 2 },
  ],
  leader: null,
};

describe("the worker's solve", () => {
  it("survives the structured clone of postMessage unchanged for a mixed equilibrium", () => {
    const here = solveForView(mixedThree);
    expect(here.ok).toBe(true);
    if (!here.ok) return;
    expect(here.result.equilibrium.kind).toBe("mixed");
    const sent = structuredClone(here);
    expect(sent).toStrictEqual(here);
  });

  it("sends the equilibrium and the statics the page would compute, unchanged", () => {
    const answer = answerForView(mixedThree);
    expect(structuredClone(answer)).toStrictEqual(answer);
    expect(answer.solved).toStrictEqual(solveForView(mixedThree));
    // an approximate mixed equilibrium is too coarse to differentiate: the solver says so
    expect(answer.statics?.ok).toBe(false);
    expect(answerForView({ ...mixedThree, leader: "North" }).statics).toBeNull();
  });
});

describe("solve state", () => {
  it("keeps the finished answer on screen while a newer input is solved", () => {
    const done: SolveState<string> = { status: "done", value: "old", ms: 12 };
    const solving = startSolving(done);
    expect(solving).toEqual({ status: "solving", previous: "old" });
    expect(shownAnswer(solving)).toBe("old");
    // a second edit before the first answer arrives still keeps the last answer
    expect(shownAnswer(startSolving(solving))).toBe("old");
  });

  it("shows nothing before the first answer and after an error", () => {
    expect(shownAnswer(startSolving<string>({ status: "idle" }))).toBeNull();
    expect(shownAnswer<string>({ status: "error", message: "solver failed: x" })).toBeNull();
    expect(shownAnswer(startSolving<string>({ status: "error", message: "x" }))).toBeNull();
  });
});
