import { describe, expect, it } from "vitest";
import { parseSessionScenario } from "@contend/protocol";
import type { EventBody, RoleView, SessionEvent } from "@contend/protocol";
import { apply, createSession, decide, fold, summarizeSession } from "@contend/session";
import type { Actor, EngineCommand, SessionState } from "@contend/session";
import {
  invitesFor,
  issuedLinkOf,
  clockOffsetMs,
  readSpend,
  remainingMs,
  withIssuedLink,
} from "../src/lib/live";
import { describeEvent, parseExport, viewAfter } from "../src/lib/replay";
import { blankDraft, describeShock, draftToShock } from "../src/lib/shockForm";
import { roundSeatRows } from "../src/lib/chartData";
import { shockLineText, shockLines } from "../src/lib/shockText";
import { playLog } from "./sessionLog";

// One rule, one place: the seat form checks a spend with the engine's rule, so it refuses
// exactly what the server refuses. Two cases where the web's own copy used to disagree: 5e-7
// on a step of 1000 (the web accepted, the server refused) and 30.00000001 against a budget of
// 30 (the web refused, the server accepted within its 1e-9 relative tolerance).
describe("readSpend: the seat form and the engine agree", () => {
  const engineVerdict = (spend: number, session: object, rivals?: object[]) => {
    const parsed = parseSessionScenario({
      title: "t",
      prize: 100,
      csf: { kind: "ratio", decisiveness: 1 },
      rivals: rivals ?? [
        { name: "A", cost: 1, budget: 30 },
        { name: "B", cost: 1 },
      ],
      session,
    });
    if (!parsed.ok) throw new Error(parsed.message);
    let state: SessionState = fold([]);
    const commit = (events: readonly EventBody[]) => {
      for (const e of events) {
        state = apply(state, { ...e, seq: state.seq + 1, at: 0 } as SessionEvent);
      }
    };
    commit([createSession({ sessionId: "s", scenario: parsed.value, seed: 1 })]);
    const run = (command: EngineCommand, actor: Actor) => {
      const d = decide(state, command, { now: 0, actor });
      if (d.ok) commit(d.events);
      return d.ok;
    };
    run({ type: "openRound" }, { role: "facilitator" });
    return run({ type: "sealMove", clientMoveId: "m", spend }, { role: "seat", seatIndex: 0 });
  };

  it("readSpend(5e-7, step 1000) refuses, as the engine does; the nearest amount is 0", () => {
    const entry = readSpend("5e-7", { cost: 1, budget: 30 }, 1000, "$");
    expect(entry).toMatchObject({ typed: true, ok: false, nearest: 0 });
    expect(engineVerdict(5e-7, { spendStep: 1000 })).toBe(false);
  });

  it("readSpend(30.00000001, budget 30) accepts, as the engine does", () => {
    const entry = readSpend("30.00000001", { cost: 1, budget: 30 }, 1e-8, "$");
    expect(entry).toMatchObject({ typed: true, ok: true });
    expect(engineVerdict(30.00000001, { spendStep: 1e-8 })).toBe(true);
    // a clear excess is refused by both, and the form says so in money
    const over = readSpend("31", { cost: 1, budget: 30 }, 1, "$");
    expect(over).toMatchObject({ ok: false, nearest: 30 });
    expect(over.typed && !over.ok && over.problem).toBe(
      "Your budget is $30; the most you can spend is $30.",
    );
    expect(engineVerdict(31, {})).toBe(false);
  });

  it("readSpend(180 at cost 1.2) is money: effort 150; a budget of 200 caps money", () => {
    expect(readSpend("180", { cost: 1.2, budget: 200 }, 1, "\u20ack")).toMatchObject({
      ok: true,
      spend: 180,
    });
    const e = readSpend("180", { cost: 1.2, budget: 200 }, 1, "\u20ack");
    expect(e.typed && e.ok && e.effort).toBeCloseTo(150, 12);
    const rivals = [
      { name: "A", cost: 1.2, budget: 200 },
      { name: "B", cost: 1 },
    ];
    expect(readSpend("201", { cost: 1.2, budget: 200 }, 1, "\u20ack")).toMatchObject({ ok: false });
    expect(engineVerdict(201, {}, rivals)).toBe(false);
    expect(engineVerdict(200, {}, rivals)).toBe(true);
  });

  it("readSpend(off-step amount) offers the nearest step in the one money format", () => {
    const e = readSpend("259.6", { cost: 1 }, 1, "\u20ack");
    expect(e.typed && !e.ok && e.problem).toBe(
      "Amounts go in steps of \u20ack1; the nearest is \u20ack260.",
    );
  });
});

describe("clockOffsetMs", () => {
  it("clockOffsetMs(sent, received, serverNow) recovers a server clock 30 s ahead over a symmetric 80 ms round trip (Cristian 1989)", () => {
    const trueOffset = 30_000;
    const sentAt = 1_000_000;
    const oneWay = 40;
    const serverNow = sentAt + oneWay + trueOffset;
    expect(clockOffsetMs(sentAt, sentAt + 2 * oneWay, serverNow)).toBe(trueOffset);
  });
  it("clockOffsetMs errs by at most half the round trip when the delays are lopsided", () => {
    // every split of a 100 ms round trip between the two directions
    for (let there = 0; there <= 100; there += 10) {
      const serverNow = 5_000 + there - 7_000; // the server's clock 7 s behind ours
      const estimate = clockOffsetMs(5_000, 5_100, serverNow);
      expect(Math.abs(estimate - -7_000)).toBeLessThanOrEqual(50);
    }
  });
  it("a countdown read on the corrected clock matches the server's remaining time", () => {
    const view = {
      status: "open",
      paused: false,
      remainingMs: null,
      deadline: 60_000,
    } as unknown as RoleView;
    const serverNow = 20_000; // 40 s left on the server
    const ourNow = serverNow - 90_000; // our clock 90 s slow
    const offset = clockOffsetMs(ourNow, ourNow, serverNow);
    expect(remainingMs(view, ourNow)).toBe(130_000); // uncorrected: 2 min 10 s instead of 40 s
    expect(remainingMs(view, ourNow + offset)).toBe(40_000);
  });
});

describe("remainingMs", () => {
  const base = {
    status: "open",
    paused: false,
    remainingMs: null,
    deadline: 10_000,
  } as unknown as RoleView;
  it("remainingMs(view, now) counts down to the deadline and stops at zero", () => {
    expect(remainingMs(base, 4_000)).toBe(6_000);
    expect(remainingMs(base, 12_000)).toBe(0);
  });
  it("remainingMs(view, now) shows the frozen remainder while paused and null without a clock", () => {
    expect(remainingMs({ ...base, paused: true, remainingMs: 2_500 }, 9_999_999)).toBe(2_500);
    expect(remainingMs({ ...base, deadline: null }, 0)).toBeNull();
    expect(remainingMs({ ...base, status: "review" }, 0)).toBeNull();
  });
});

describe("invite links", () => {
  const seat = (index: number, name: string) => ({
    index,
    name,
    kind: "human",
    claimed: false,
    displayName: null,
    sealed: false,
    active: true,
  });
  const view = {
    role: "facilitator",
    joinCode: "KIOSK7",
    seats: [seat(0, "North Bakery"), seat(1, "Corner Ovens")],
  } as unknown as RoleView;
  const stored = {
    joinCode: "KIOSK7",
    links: {
      facilitator: "/facilitate/s?key=f",
      spectator: "/screen/s?key=p",
      join: "/join?code=KIOSK7",
    },
    seats: [{ index: 0, name: "North Bakery", link: "/seat/s?key=a" }],
  };

  it("invitesFor(view, nothing stored) has the view's join code and every seat without a link", () => {
    expect(invitesFor(view, null)).toEqual({
      joinCode: "KIOSK7",
      links: { facilitator: "", spectator: "", join: "/join?code=KIOSK7" },
      seats: [
        { index: 0, name: "North Bakery", link: null },
        { index: 1, name: "Corner Ovens", link: null },
      ],
    });
  });

  it("invitesFor(view, stored) keeps the stored links (the creating browser's fast path)", () => {
    const inv = invitesFor(view, stored);
    expect(inv.links).toEqual(stored.links);
    expect(inv.seats.map((s) => s.link)).toEqual(["/seat/s?key=a", null]);
  });

  it("withIssuedLink(invites, ack data) replaces that seat's or the screen's link only", () => {
    const inv = invitesFor(view, stored);
    const seat1 = withIssuedLink(inv, {
      seq: 3,
      role: "seat",
      seatIndex: 1,
      key: "b",
      link: "http://h/seat/s?key=b",
    });
    expect(seat1.seats.map((s) => s.link)).toEqual(["/seat/s?key=a", "http://h/seat/s?key=b"]);
    expect(seat1.links).toEqual(inv.links);
    const screen = withIssuedLink(seat1, {
      seq: 3,
      role: "spectator",
      seatIndex: null,
      key: "q",
      link: "http://h/screen/s?key=q",
    });
    expect(screen.links.spectator).toBe("http://h/screen/s?key=q");
    expect(screen.seats).toEqual(seat1.seats);
  });

  it("issuedLinkOf(ack data) picks issueLinks data and ignores other acks", () => {
    const data = { seq: 1, role: "seat" as const, seatIndex: 0, key: "k", link: "/seat/s?key=k" };
    expect(issuedLinkOf(data)).toBe(data);
    expect(issuedLinkOf({ seq: 1 })).toBeNull();
    expect(issuedLinkOf({ seq: 1, sessionId: "s", seatIndex: 0, seatKey: "k" })).toBeNull();
  });
});

describe("draftToShock", () => {
  it("draftToShock(draft) builds each protocol shock and resets a blank optional field to its default", () => {
    expect(draftToShock({ ...blankDraft(), index: "1", field: "cost", value: "2.5" })).toEqual({
      ok: true,
      shock: { target: "rival", index: 1, field: "cost", value: 2.5 },
    });
    expect(draftToShock({ ...blankDraft(), field: "budget", value: "" })).toEqual({
      ok: true,
      shock: { target: "rival", index: 0, field: "budget", value: null },
    });
    expect(
      draftToShock({ ...blankDraft(), target: "csf", csfKind: "logit", csfParam: "0.2" }),
    ).toEqual({
      ok: true,
      shock: { target: "csf", csf: { kind: "logit", scale: 0.2 } },
    });
    expect(
      draftToShock({
        ...blankDraft(),
        target: "add-rival",
        name: " New Co ",
        cost: "1.2",
        policy: "equilibrium",
      }),
    ).toEqual({
      ok: true,
      shock: {
        target: "add-rival",
        rival: { name: "New Co", cost: 1.2 },
        policy: { kind: "equilibrium" },
      },
    });
  });
  it("draftToShock(draft) names the field when text is not a number or a name is missing", () => {
    expect(draftToShock({ ...blankDraft(), target: "prize", value: "lots" })).toEqual({
      ok: false,
      message: "prize must be a number",
    });
    expect(draftToShock({ ...blankDraft(), field: "cost", value: "" }).ok).toBe(false);
    expect(draftToShock({ ...blankDraft(), target: "add-rival", name: "" }).ok).toBe(false);
  });
  it("describeShock(shock, names) reads as plain text", () => {
    expect(describeShock({ target: "retire-rival", index: 1 }, ["A", "B"])).toBe("Retire B");
  });
});

describe("replay", () => {
  it("viewAfter(events, k) stops the engine's fold at event k", () => {
    const log = playLog();
    const open = log.findIndex((e) => e.type === "round-opened") + 1;
    const atOpen = viewAfter(log, open);
    expect(atOpen.ok && atOpen.view.status).toBe("open");
    const end = viewAfter(log, log.length);
    expect(end.ok && end.view.status).toBe("review");
    expect(end.ok && end.view.rounds).toHaveLength(1);
  });
  it("viewAfter(events, last) reproduces the stored round in money: seat 0's spend and the equilibrium spends m_i e_i (Hillman & Riley 1989, e1 = v m2/(m1+m2)^2)", () => {
    const end = viewAfter(playLog(), Infinity);
    if (!end.ok) throw new Error(end.message);
    expect(end.view.rounds[0]!.efforts[0]).toBe(3);
    const rows = roundSeatRows(end.view.rounds[0]!, ["North Bakery", "Corner Ovens"]);
    expect(rows[0]?.spend).toBe(15);
    // both equilibrium spends are v m1 m2 / (m1 + m2)^2 = 1000/49
    expect(rows[0]?.equilibrium as number).toBeCloseTo((5 * 100 * 2) / 49, 6);
    expect(rows[1]?.equilibrium as number).toBeCloseTo((2 * 100 * 5) / 49, 6);
  });
  it("the debrief's seat table (summarizeSession of the log) averages spend and equilibrium spend per seat", () => {
    const log = playLog();
    const end = viewAfter(log, Infinity);
    if (!end.ok) throw new Error(end.message);
    const rows = summarizeSession(log)!.seats;
    // money: North Bakery (cost 5) spent 15; its equilibrium spend is 5 x 200/49
    expect(rows[0]).toMatchObject({ seat: 0, rounds: 1, meanSpend: 15 });
    expect(rows[0]?.meanEquilibriumSpend as number).toBeCloseTo((5 * 200) / 49, 6);
    expect(rows[0]?.totalRegret).toBeCloseTo(end.view.rounds[0]!.regrets[0]!, 12);
  });
  it("describeEvent(event, names) names the seat and the round", () => {
    const log = playLog();
    const sealed = log.find((e) => e.type === "move-sealed" && e.seatIndex === 0)!;
    expect(describeEvent(sealed, ["North Bakery", "Corner Ovens"])).toBe(
      "North Bakery sealed a move in round 1",
    );
  });
  it("parseExport(raw) accepts a well-formed export and explains a broken one", () => {
    const log = playLog();
    const session = {
      id: "s-1",
      title: "t",
      status: "review",
      createdAt: "2026-01-01T00:00:00Z",
      updatedAt: "2026-01-01T00:00:00Z",
      rounds: 1,
    };
    expect(parseExport({ session, events: log, rounds: [] }).ok).toBe(true);
    const bad = parseExport({ session, events: "nope", rounds: [] });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.message).toMatch(/events/);
  });
  it("parseExport(an export written before spends) reads in money: spend = cost x effort", () => {
    const log = playLog();
    // strip every money field from the events and keep the old-style rounds (efforts only)
    const old = log.map((e) => {
      const {
        spend: _s,
        spends: _ss,
        ...rest
      } = e as SessionEvent & {
        spend?: number;
        spends?: number[];
      };
      return rest;
    });
    const oldRounds = [{ round: 1, efforts: [3, 10] }];
    const session = {
      id: "s-1",
      title: "t",
      status: "review",
      createdAt: "2026-01-01T00:00:00Z",
      updatedAt: "2026-01-01T00:00:00Z",
      rounds: 1,
    };
    const parsed = parseExport({ session, events: old, rounds: oldRounds });
    if (!parsed.ok) throw new Error(parsed.message);
    // North Bakery (cost 5) played effort 3: a spend of 15; Corner Ovens (cost 2) effort 10: 20
    expect(parsed.value.rounds[0]!.spends).toEqual([15, 20]);
    expect(parsed.value.shocks).toEqual([]);
  });
});

describe("shock text", () => {
  const before = {
    title: "t",
    prize: 1000,
    currency: "\u20ack",
    csf: { kind: "ratio" as const, decisiveness: 1 },
    rivals: [
      { name: "Quayside", cost: 1.2, budget: 200 },
      { name: "Tidewater", cost: 1 },
    ],
  };
  it("shockLines(record) says what changed, from what to what, in money", () => {
    const after = {
      ...before,
      prize: 1500,
      rivals: [{ ...before.rivals[0]!, cost: 1.5, budget: null }, before.rivals[1]!],
    };
    const lines = shockLines(
      {
        afterRound: 2,
        changes: [
          { target: "prize", value: 1500 },
          { target: "rival", index: 0, field: "cost", value: 1.5 },
          { target: "rival", index: 0, field: "budget", value: null },
        ],
        before,
        after,
      },
      "\u20ack",
    ).map(shockLineText);
    expect(lines).toEqual([
      "Prize: \u20ack1,000 \u2192 \u20ack1,500",
      "Quayside: cost per unit of effort: \u20ack1.2 \u2192 \u20ack1.5",
      "Quayside: budget: \u20ack200 \u2192 no cap",
    ]);
  });
  it("shockLines(retire) names the retired rival; changesBetweenRounds reads rounds alone", () => {
    const lines = shockLines(
      {
        afterRound: 1,
        changes: [{ target: "retire-rival", index: 1 }],
        before,
        after: before,
      },
      null,
    );
    expect(lines.map(shockLineText)).toEqual(["Tidewater: in the contest \u2192 retired"]);
  });
});
