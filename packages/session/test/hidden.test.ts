/**
 * Private numbers (docs/protocol.md R40-R44). Demo data are invented (bakeries bidding for a
 * kiosk lease); checks are against closed forms and independent quadrature, not the engine's
 * own code paths.
 */
import { describe, expect, it } from "vitest";
import { roleViewSchema } from "@contend/protocol";
import { fold, viewFor } from "../src/index";
import type { Viewer } from "../src/index";
import { expectLogValid, facilitator, guest, Room, scenarioWith, seat } from "./harness";

// Distinctive truths (no other number of these sessions equals them).
const TRUE_COST = 2.375;
const TRUE_VALUE = 93.75;

function hiddenSession(hidden: Record<string, unknown>, rivals?: unknown[]) {
  return scenarioWith(
    { rounds: 2, hidden },
    {
      rivals: rivals ?? [
        { name: "North Bakery", cost: 1 },
        { name: "Corner Ovens", cost: TRUE_COST, value: TRUE_VALUE },
      ],
    },
  );
}

const cornerPrivate = {
  truth: "scenario",
  rivals: {
    "Corner Ovens": {
      cost: { dist: "uniform", low: 1.5, high: 3 },
      value: { dist: "triangular", low: 80, mode: 100, high: 110 },
    },
  },
};

function playRound(room: Room, spends: number[]) {
  if (room.state.status !== "open") room.ok({ type: "openRound" }, facilitator);
  spends.forEach((s, i) =>
    room.ok({ type: "sealMove", clientMoveId: `r-${i}-${s}`, spend: s }, seat(i)),
  );
  if (room.state.status === "open") room.ok({ type: "closeRound" }, facilitator);
}

function claimAll(room: Room, n: number) {
  for (let i = 0; i < n; i++)
    room.ok({ type: "claimSeat", seatIndex: i, displayName: `P${i}` }, guest);
}

const text = (v: unknown) => JSON.stringify(v);
const has = (s: string, x: number) =>
  new RegExp(`[:\\[,]${String(x).replace(".", "\\.")}[,\\]}]`).test(s);

describe("R40 the truth", () => {
  it("is drawn from the ranges with the session seed, inside them, and stored in the log", () => {
    const scenario = hiddenSession({
      rivals: {
        "North Bakery": { cost: { dist: "uniform", low: 0.5, high: 1.5 } },
        "Corner Ovens": { value: { dist: "uniform", low: 60, high: 140 } },
      },
    });
    const a = new Room(scenario, 11);
    const b = new Room(scenario, 11);
    const c = new Room(scenario, 12);
    const truthOf = (r: Room) => {
      const e = r.log[0]!;
      if (e.type !== "session-created") throw new Error("first event");
      return [e.scenario.rivals[0]!.cost, e.scenario.rivals[1]!.value];
    };
    const [cost, value] = truthOf(a);
    expect(cost).toBeGreaterThanOrEqual(0.5);
    expect(cost).toBeLessThanOrEqual(1.5);
    expect(value).toBeGreaterThanOrEqual(60);
    expect(value).toBeLessThanOrEqual(140);
    expect(truthOf(b)).toEqual(truthOf(a));
    expect(truthOf(c)).not.toEqual(truthOf(a));
    // the folded state plays under the drawn truth
    if (a.state.status === "empty") throw new Error("empty");
    expect(a.state.scenario.rivals[0]!.cost).toBe(cost);
    expectLogValid(a.log);
  });

  it('with truth "scenario" keeps the scenario\'s own numbers', () => {
    const room = new Room(hiddenSession(cornerPrivate));
    if (room.state.status === "empty") throw new Error("empty");
    expect(room.state.scenario.rivals[1]).toMatchObject({ cost: TRUE_COST, value: TRUE_VALUE });
  });
});

describe("R41 views withhold the truth until the end", () => {
  const viewers: [string, Viewer][] = [
    ["seat 0", { role: "seat", seatIndex: 0 }],
    ["spectator", { role: "spectator" }],
    ["guest", { role: "guest" }],
  ];

  it("no seat, screen or guest view holds a private number; the owner and the facilitator do", () => {
    const room = new Room(hiddenSession(cornerPrivate));
    claimAll(room, 2);
    const check = () => {
      for (const [who, viewer] of viewers) {
        const v = viewFor(room.state, viewer);
        expect(roleViewSchema.safeParse(v).success, who).toBe(true);
        for (const x of [TRUE_COST, TRUE_VALUE])
          expect(has(text(v), x), `${who} saw ${x}`).toBe(false);
        expect(v.hidden?.withheld).toBe(true);
        // R42: the belief summary is the mean of the range
        expect(v.scenario.rivals[1]).toMatchObject({ cost: 2.25, value: (80 + 100 + 110) / 3 });
      }
      // positive control: the same search finds the truth where it may be
      for (const viewer of [{ role: "seat", seatIndex: 1 }, facilitator] as Viewer[]) {
        const s = text(viewFor(room.state, viewer));
        expect(has(s, TRUE_COST), viewer.role).toBe(true);
        expect(has(s, TRUE_VALUE), viewer.role).toBe(true);
      }
    };
    check();
    playRound(room, [20, 15]);
    check();
    const mine = viewFor(room.state, { role: "seat", seatIndex: 0 });
    expect(mine.rounds).toEqual([]);
    expect(mine.hidden!.rounds).toHaveLength(1);
    const r = mine.hidden!.rounds[0]!;
    expect(r.spends).toEqual([20, 15]);
    expect(r.you!.spend).toBe(20);
    // own payoff: v0 p0 - s0 with e0 = 20, e1 = 15 / TRUE_COST (Tullock 1980 share)
    const e1 = 15 / TRUE_COST;
    expect(r.you!.payoff).toBeCloseTo((100 * 20) / (20 + e1) - 20, 9);
    // R43: the truth reply is the Tullock best reply sqrt(v x) - x to the rival's true effort
    expect(r.you!.truthReplySpend).toBeCloseTo(Math.sqrt(100 * e1) - e1, 4);
    expect(viewFor(room.state, { role: "spectator" }).hidden!.rounds[0]!.you).toBeNull();

    playRound(room, [20, 15]); // the second and last round ends the session
    expect(room.state.status).toBe("ended");
    for (const [who, viewer] of viewers) {
      const v = viewFor(room.state, viewer);
      expect(v.hidden!.withheld, who).toBe(false);
      expect(has(text(v), TRUE_COST), who).toBe(true);
      expect(v.rounds, who).toHaveLength(2);
    }
    expectLogValid(room.log);

    // a replay of the ended log shows the truth at a step before the end, not otherwise
    const step = fold(room.log.slice(0, -1));
    expect(step.status).toBe("review");
    const replayed = viewFor(step, { role: "spectator", revealed: true });
    expect(replayed.hidden!.withheld).toBe(false);
    expect(has(text(replayed), TRUE_COST)).toBe(true);
    expect(has(text(viewFor(step, { role: "spectator" })), TRUE_COST)).toBe(false);
  });
});

/** E over c ~ U[lo, hi] of v s/(s + spend/c) - s, by the composite Simpson rule. */
function expectedPayoff(s: number, v: number, spend: number, lo: number, hi: number): number {
  const m = 2000;
  const h = (hi - lo) / m;
  let sum = 0;
  for (let k = 0; k <= m; k++) {
    const c = lo + k * h;
    const f = (v * s) / (s + spend / c) - s;
    sum += (k === 0 || k === m ? 1 : k % 2 ? 4 : 2) * f;
  }
  return (sum * h) / 3 / (hi - lo);
}

describe("R43 the best reply under beliefs", () => {
  it("maximises expected payoff over the rival's cost range (independent quadrature)", () => {
    const room = new Room(hiddenSession(cornerPrivate));
    claimAll(room, 2);
    playRound(room, [20, 30]);
    const r = room.state.status === "empty" ? null : room.state.rounds[0]!;
    const belief = r!.beliefReplySpends![0]!;
    // golden-section search on the quadrature (the expectation is concave in s)
    let a = 0;
    let b = 100;
    const g = (Math.sqrt(5) - 1) / 2;
    for (let k = 0; k < 80; k++) {
      const x1 = b - g * (b - a);
      const x2 = a + g * (b - a);
      if (expectedPayoff(x1, 100, 30, 1.5, 3) < expectedPayoff(x2, 100, 30, 1.5, 3)) a = x1;
      else b = x2;
    }
    const exact = (a + b) / 2;
    // 256 draws: the sample optimum lies within 2% of the exact one here
    expect(Math.abs(belief - exact) / exact).toBeLessThan(0.02);
    // and it is not the truth reply: the beliefs differ from the truth
    const truth = Math.sqrt(100 * (30 / TRUE_COST)) - 30 / TRUE_COST;
    expect(Math.abs(belief - truth)).toBeGreaterThan(0.1);
    // the seat whose rival has no private numbers: belief reply = truth reply
    expect(r!.beliefReplySpends![1]!).toBeCloseTo(r!.bestResponseSpends[1]!, 6);
  });
});

describe("R41 computer seats know what a human seat knows", () => {
  it("an equilibrium-playing computer plays the equilibrium of its beliefs, not of the truth", () => {
    const room = new Room(
      scenarioWith(
        { rounds: 2, hidden: cornerPrivate, computer: { "North Bakery": { kind: "equilibrium" } } },
        {
          rivals: [
            { name: "North Bakery", cost: 1 },
            { name: "Corner Ovens", cost: TRUE_COST, value: TRUE_VALUE },
          ],
        },
      ),
    );
    room.ok({ type: "openRound" }, facilitator);
    const sealed = room.log.find((e) => e.type === "move-sealed");
    if (sealed?.type !== "move-sealed") throw new Error("no computer move");
    // beliefs: Corner Ovens at cost 2.25 (mean of U[1.5, 3]) and value 290/3 (triangular mean);
    // two rivals, r = 1: e_0 = w_0^2 w_1 / (w_0 + w_1)^2 with w_i = v_i / c_i (Nti 1999)
    const w0 = 100;
    const believed = 290 / 3 / 2.25;
    const truth = TRUE_VALUE / TRUE_COST;
    const eq = (a: number, b: number) => (a * a * b) / (a + b) ** 2;
    // the money grid is 1, so the spend is the equilibrium spend rounded to a whole unit
    expect(Math.abs(sealed.spend! - eq(w0, believed))).toBeLessThanOrEqual(0.5);
    expect(Math.round(eq(w0, believed))).not.toBe(Math.round(eq(w0, truth)));
  });
});

describe("R44 robust plans at the end", () => {
  it("are stored in session-ended; with nothing private about the rival the plan is the equilibrium spend", () => {
    const room = new Room(hiddenSession(cornerPrivate));
    claimAll(room, 2);
    room.ok({ type: "endSession" }, facilitator);
    const ended = room.lastEvent();
    if (ended.type !== "session-ended") throw new Error("not ended");
    const plans = ended.robustPlans!;
    expect(plans.map((p) => p.seatIndex)).toEqual([0, 1]);
    // Corner Ovens knows North Bakery's numbers (cost 1, value 100) and its own, so its plan
    // has nothing to average over: the equilibrium of two rivals, r = 1, with values per unit
    // cost w_i = v_i / c_i, e_i = w_i^2 w_j / (w_i + w_j)^2 (Hillman & Riley 1989; Nti 1999),
    // spent as money c_i e_i.
    const w0 = 100 / 1;
    const w1 = TRUE_VALUE / TRUE_COST;
    const e1 = (w1 * w1 * w0) / (w0 + w1) ** 2;
    expect(plans[1]!.spend).toBeCloseTo(TRUE_COST * e1, 2);
    // North Bakery is unsure of its rival: its plan differs from that equilibrium's spend
    const e0 = (w0 * w0 * w1) / (w0 + w1) ** 2;
    expect(Math.abs(plans[0]!.spend - e0)).toBeGreaterThan(0.01);
    for (const p of plans) expect(p.meanRegret).toBeGreaterThanOrEqual(0);
    expectLogValid(room.log);
  });
});
