import { describe, expect, it } from "vitest";
import { createGroupCommit, groupMember } from "../src/repos/groupCommit";
import type { PreparedStatement, PreparedValue, SqlRunner } from "../src/sqlRunner";

/**
 * A database stand-in that records each group statement and answers only when the test says
 * so, to see how many groups are in flight and which sessions each holds ($3 is the array of
 * the members' session ids).
 */
function heldRunner() {
  const calls: Array<{
    sessions: string[];
    params: readonly PreparedValue[];
    answer: () => void;
  }> = [];
  const runner: SqlRunner = {
    transaction: () => Promise.reject(new Error("not used")),
    query: () => Promise.reject(new Error("not used")),
    prepared: <Row extends Record<string, unknown>>(
      _statement: PreparedStatement,
      params: readonly PreparedValue[],
    ) => {
      const sessions = [...(params[2] as string[])];
      return new Promise<Row[]>((resolve) => {
        calls.push({
          sessions,
          params,
          answer: () => resolve(sessions.map((_, i) => ({ i, won: true }) as unknown as Row)),
        });
      });
    },
  };
  return { runner, calls };
}

const turn = () => new Promise((r) => setImmediate(r));
const member = (sessionId: string, expected: number) =>
  groupMember(sessionId, expected, [{ type: "tick", at: 1, payload: {} }], undefined);
const never = () => Promise.reject(new Error("no group should fail here"));

describe("group commit", () => {
  it("starts the next group while one is in flight, never with a session that is in flight", async () => {
    const { runner, calls } = heldRunner();
    const group = createGroupCommit(runner);
    const a1 = group.append(member("a", 1), never);
    const b1 = group.append(member("b", 1), never);
    await turn();
    expect(calls.map((c) => c.sessions)).toEqual([["a", "b"]]);
    // a's next append must wait for its first; c's may go at once, in a second group
    const a2 = group.append(member("a", 2), never);
    const c1 = group.append(member("c", 1), never);
    await turn();
    expect(calls.map((c) => c.sessions)).toEqual([["a", "b"], ["c"]]);
    // two in flight: nothing else starts until one answers
    const d1 = group.append(member("d", 1), never);
    await turn();
    expect(calls).toHaveLength(2);
    calls[0]!.answer();
    expect(await a1).toEqual({ ok: true, seqs: [2] });
    expect(await b1).toEqual({ ok: true, seqs: [2] });
    await turn();
    expect(calls.map((c) => c.sessions)).toEqual([["a", "b"], ["c"], ["a", "d"]]);
    calls[1]!.answer();
    calls[2]!.answer();
    expect(await Promise.all([c1, a2, d1])).toEqual([
      { ok: true, seqs: [2] },
      { ok: true, seqs: [3] },
      { ok: true, seqs: [2] },
    ]);
  });

  it("sends each member's seat claims with the member's position in the group", async () => {
    const { runner, calls } = heldRunner();
    const group = createGroupCommit(runner);
    const claim = groupMember("b", 1, [{ type: "seat-claimed", at: 1, payload: {} }], undefined, [
      { seatIndex: 2, displayName: "Bo" },
      { seatIndex: 3, displayName: "Cy" },
    ]);
    const results = [group.append(member("a", 1), never), group.append(claim, never)];
    await turn();
    expect(calls).toHaveLength(1);
    // $12..$14: the claiming member's index in the group, seat indices, display names
    expect(calls[0]!.params.slice(11)).toEqual([
      [1, 1],
      [2, 3],
      ["Bo", "Cy"],
    ]);
    calls[0]!.answer();
    expect(await Promise.all(results)).toEqual([
      { ok: true, seqs: [2] },
      { ok: true, seqs: [2] },
    ]);
  });
});
