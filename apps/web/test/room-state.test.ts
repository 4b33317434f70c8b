import { describe, expect, it } from "vitest";
import type { RoleView } from "@contend/protocol";
import {
  announcement,
  headline,
  nextAction,
  sessionSummary,
  standings,
} from "../src/lib/roomState";
import { viewAfter } from "../src/lib/replay";
import { playLog } from "./sessionLog";

/** The spectator view after each event of a real engine log (2 rounds, 1 played). */
function views(): RoleView[] {
  const log = playLog();
  return log.map((_, k) => {
    const v = viewAfter(log, k + 1);
    if (!v.ok) throw new Error(v.message);
    return v.view;
  });
}

describe("room state in words", () => {
  it("follows the session from the lobby through an open round to its reveal", () => {
    const vs = views();
    const lobby = vs[0]!;
    expect(lobby.status).toBe("lobby");
    expect(headline(lobby)).toMatchObject({ tone: "waiting", title: "Waiting to start" });
    expect(nextAction(lobby)).toEqual({ kind: "open", round: 1, label: "Open round 1 of 2" });

    const open = vs.find((v) => v.status === "open")!;
    expect(headline(open).title).toBe("Round 1 open");
    expect(nextAction(open)).toEqual({ kind: "close", label: "Close round 1 and reveal" });
    expect(announcement(lobby, open)).toBe("Round 1 is open.");

    const review = vs.at(-1)!;
    expect(review.status).toBe("review");
    expect(headline(review)).toMatchObject({
      title: "Round 1 revealed",
      detail: "Round 2 of 2 comes next",
    });
    expect(nextAction(review)).toMatchObject({ kind: "open", label: "Open round 2 of 2" });
    expect(announcement(open, review)).toBe("Round 1 revealed.");
    expect(announcement(review, review)).toBeNull();
  });

  it("counts the seals of the open round", () => {
    const vs = views();
    const open = vs.filter((v) => v.status === "open");
    const details = open.map((v) => headline(v).detail);
    expect(details[0]).toBe("0 of 2 sealed");
    expect(details).toContain("1 of 2 sealed"); // the computer seat's move
    expect(details.at(-1)).toBe("2 of 2 sealed");
  });

  it("after the end says so and never offers another round", () => {
    const review = views().at(-1)!;
    const ended: RoleView = { ...review, status: "ended", endedReason: "facilitator" };
    expect(headline(ended)).toEqual({
      tone: "ended",
      title: "Final standings",
      detail: "Session ended after 1 round",
    });
    expect(nextAction(ended)).toEqual({ kind: "none", label: "Session ended" });
    expect(announcement(review, ended)).toBe("The session has ended.");
    const last: RoleView = { ...review, round: 2, roundsTotal: 2 };
    expect(nextAction(last).kind).toBe("end");
  });

  it("puts pause first", () => {
    const open = views().find((v) => v.status === "open")!;
    const paused: RoleView = { ...open, paused: true };
    expect(headline(paused).title).toBe("Paused");
    expect(nextAction(paused).kind).toBe("resume");
    expect(announcement(open, paused)).toBe("Paused.");
    expect(announcement(paused, open)).toBe("Resumed.");
  });

  it("announces a shock: what changed, from what to what, and the round it applies to", () => {
    const review = views().at(-1)!;
    const before = review.scenario;
    const after = { ...before, prize: before.prize * 2 };
    const shocked: RoleView = {
      ...review,
      scenario: after,
      shocks: [
        ...review.shocks,
        {
          afterRound: review.rounds.length,
          changes: [{ target: "prize", value: after.prize }],
          before,
          after,
        },
      ],
    };
    const said = announcement(review, shocked);
    expect(said).toMatch(
      new RegExp(`^The contest changes from round ${review.rounds.length + 1}: Prize: `),
    );
    expect(said).toContain("\u2192");
    // said once: the same shocks again are no news
    expect(announcement(shocked, shocked)).toBeNull();
    // a shock and the next round opening together are both said
    const open: RoleView = { ...shocked, status: "open", round: review.round + 1 };
    expect(announcement(review, open)).toMatch(/Prize: .* Round \d+ is open\.$/);
  });

  it("standings rank by total with ties sharing a rank; the summary reads the rounds", () => {
    const review = views().at(-1)!;
    const round = review.rounds[0]!;
    const ranked = standings({ ...review, totals: [10, 10] });
    expect(ranked.map((r) => r.rank)).toEqual([1, 1]);
    const s = standings(review);
    expect(s[0]!.total).toBeGreaterThanOrEqual(s[1]!.total);
    const summary = sessionSummary(review.rounds);
    expect(summary.rounds).toBe(1);
    expect(summary.meanDissipation).toBe(round.dissipation);
    expect(summary.widestGap).toEqual({ round: 1, gap: round.nashGap });
  });
});
