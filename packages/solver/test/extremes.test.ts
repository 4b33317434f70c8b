// No wrong number at the extremes: every case of the extreme-value audit becomes a test.
// A result is either right (checked by the model's homogeneity: efforts scale with value /
// cost and payoffs with the prize, common practice, no source; or by a best response written
// out from the definition, reference.ts) or reported out of range, never as pure with gap 0.
import { describe, expect, test } from "vitest";
import { main, type CliIo } from "../src/cli/cli";
import { runRespond } from "../src/cli/respondCommand";
import { normalize, respond, solve, OUT_OF_RANGE } from "../src/index";
import type { CsfSpec, RivalSpec, Scenario } from "../src/types";
import { refPayoff } from "./reference";

const scenario = (csf: CsfSpec, rivals: RivalSpec[], prize = 100): Scenario => ({
  title: "extreme",
  prize,
  csf,
  rivals,
});
const ratio = (r: number): CsfSpec => ({ kind: "ratio", decisiveness: r });

async function cli(s: Scenario, ...args: string[]) {
  let stdout = "";
  let stderr = "";
  const io: CliIo = {
    stdout: { write: (x: string) => (stdout += x) },
    stderr: { write: (x: string) => (stderr += x) },
    readFile: async () => JSON.stringify(s),
  };
  const code = await main([args[0]!, "s.json", ...args.slice(1)], io);
  return { code, stdout, stderr };
}

describe("solve at extreme magnitudes", () => {
  test("solve(cost 1e-300, value 1e300): efforts of 1e600 cannot be represented, so out of range and the CLI exits 2", async () => {
    for (const costs of [
      [1e-300, 1e-300],
      [1e-300, 2e-300],
    ]) {
      const s = scenario(
        ratio(1),
        costs.map((cost, i) => ({ name: `r${i}`, cost })),
        1e300,
      );
      const eq = solve(normalize(s)).equilibrium;
      expect(eq.kind).toBe("none-pure");
      expect(eq.efforts).toBeNull();
      expect(eq.outOfRange).toBeTruthy();
      const r = await cli(s, "solve", "--json");
      expect(r.code).toBe(2);
      expect(r.stdout).toBe("");
      expect(r.stderr).toMatch(new RegExp(`^${OUT_OF_RANGE}: `));
    }
  });

  test("solve(two rivals, r = 0.5, prize 1e-300 ... 1e300): right by homogeneity (efforts and payoffs scale with the prize) or out of range", () => {
    const at = (P: number) =>
      solve(
        normalize(
          scenario(
            ratio(0.5),
            [
              { name: "a", cost: 1 },
              { name: "b", cost: 2, value: P / 2 },
            ],
            P,
          ),
        ),
      ).equilibrium;
    const base = at(1);
    let right = 0;
    for (let k = -300; k <= 300; k += 25) {
      const P = Math.pow(10, k);
      const eq = at(P);
      if (eq.outOfRange) {
        expect(eq.kind).toBe("none-pure");
        expect(eq.efforts).toBeNull();
        continue;
      }
      right++;
      expect(eq.kind).toBe("pure");
      expect(eq.nashGap).toBeLessThanOrEqual(1e-6 * P);
      for (const i of [0, 1]) {
        expect(eq.efforts![i]! / P).toBeCloseTo(base.efforts![i]!, 9);
        expect(eq.payoffs![i]! / P).toBeCloseTo(base.payoffs![i]!, 9);
      }
    }
    // solved in units of the prize, every magnitude of the audit (which saw Infinity labelled
    // pure from 1e104 - 1e154 on) is answered right
    expect(right).toBe(25);
  });

  test("solve(value 1e-300): Hillman-Riley efforts v m_2 / (m_1 + m_2)^2 and a gap below 1e-6 of the prize", () => {
    const s = scenario(
      ratio(1),
      [
        { name: "a", cost: 1 },
        { name: "b", cost: 2 },
      ],
      1e-300,
    );
    const eq = solve(normalize(s)).equilibrium;
    expect(eq.kind).toBe("pure");
    expect(eq.efforts![0]! / ((1e-300 * 2) / 9)).toBeCloseTo(1, 9);
    expect(eq.nashGap).toBeLessThanOrEqual(1e-6 * 1e-300);
  });

  test.each([1e15, 1e17, 1e20])(
    "solve(logit, scale %d, identical rivals) never answers pure [0, 0]; respond at [0, 0] finds regret v/2",
    (k) => {
      const c = normalize(
        scenario({ kind: "logit", scale: k }, [
          { name: "a", cost: 1 },
          { name: "b", cost: 1 },
        ]),
      );
      const eq = solve(c).equilibrium;
      expect(eq.kind).not.toBe("pure");
      if (eq.kind === "mixed") expect(eq.nashGap).toBeLessThan(1e-3 * c.prize);
      const res = respond(c, [0, 0]);
      // reference: spending 40 / k wins with probability 1 / (1 + e^-40) at negligible cost
      const ref = refPayoff(c, 0, 40 / k, [40 / k, 0]) - refPayoff(c, 0, 0, [0, 0]);
      expect(ref).toBeCloseTo(50, 6);
      expect(res.regrets[0]).toBeGreaterThanOrEqual(ref - 1e-9);
      expect(res.nashGap).toBeCloseTo(50, 6);
    },
  );
});

describe("respond at extreme efforts", () => {
  const s2 = scenario(ratio(2), [
    { name: "a", cost: 1 },
    { name: "b", cost: 1 },
  ]);

  test("respond(r = 2, efforts 1e155): w e^r overflows, so the CLI exits 2 instead of printing null payoffs and gap 0", async () => {
    const c = normalize(s2);
    const out = runRespond(s2, c, [1e155, 1e155], true);
    expect(out.ok).toBe(false);
    const r = await cli(s2, "respond", "--efforts", "1e155,1e155");
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(new RegExp(`^${OUT_OF_RANGE}: `));
  });

  test("respond(r = 1, efforts 1e308): payoffs -1e308 and regrets 1e308 (spending nothing is the best reply) are right and printed", async () => {
    const s1 = { ...s2, csf: ratio(1) };
    const c = normalize(s1);
    const res = respond(c, [1e308, 1e308]);
    for (const i of [0, 1]) {
      expect(res.payoffs[i]).toBe(-1e308);
      expect(res.bestResponses[i]).toBe(0);
      expect(res.regrets[i]).toBe(1e308);
    }
    const r = await cli(s1, "respond", "--efforts", "1e308,1e308", "--json");
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).nashGap).toBe(1e308);
  });
});
