/**
 * Pushed views written once per push (src/socket/encode.ts) must reach clients as exactly the
 * bytes socket.io's own encoder (socket.io-parser, the reference) writes for the same packet,
 * so the browser's standard decoder reads them unchanged. Checked on every patch and full view
 * of a real session's rounds (all roles), and on text that needs escaping.
 */
import { describe, expect, it } from "vitest";
import { Decoder, Encoder, PacketType } from "socket.io-parser";
import type { Packet } from "socket.io-parser";
import { diffJson, parseSessionScenario } from "@contend/protocol";
import type { RoleView, SessionEvent } from "@contend/protocol";
import { apply, createSession, decide, fold, viewFor } from "@contend/session";
import type { EngineCommand, Viewer } from "@contend/session";
import { patchPayload, serverParser, viewPayload } from "../src/socket/encode";
import type { TextCache } from "../src/socket/encode";

const reference = new Encoder();
const ours = new serverParser.Encoder();

function packet(event: string, payload: object) {
  return { type: PacketType.EVENT, nsp: "/", data: [event, payload] };
}

function decoded(text: string): unknown {
  const decoder = new Decoder();
  let out: unknown;
  decoder.on("decoded", (p: Packet) => {
    out = p.data;
  });
  decoder.add(text);
  return out;
}

/** An invented session: three bakeries, one with a name that needs escaping in JSON. */
function playedSession() {
  const parsed = parseSessionScenario({
    title: 'Kiosk "north" lease \\ café ✓',
    prize: 1000,
    currency: "$",
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: [
      { name: "North Bakery", cost: 1 },
      { name: 'Corner "Ovens" \u00e9', cost: 1.25 },
      { name: "Rye & Crumb ~/ path", cost: 1.5, budget: 300 },
    ],
    session: { rounds: 3, computer: { "Rye & Crumb ~/ path": { kind: "equilibrium" } } },
  });
  if (!parsed.ok) throw new Error(parsed.message);
  let state = fold([]);
  let seq = 0;
  const states = [] as (typeof state)[];
  const commit = (bodies: readonly object[]) => {
    for (const body of bodies) {
      state = apply(state, { ...body, seq: ++seq, at: 1_000 + seq } as SessionEvent);
      states.push(state);
    }
  };
  commit([createSession({ sessionId: "s-1", scenario: parsed.value, seed: 3 })]);
  const run = (command: EngineCommand, actor: Parameters<typeof decide>[2]["actor"]) => {
    const d = decide(state, command, { now: 2_000, actor });
    if (!d.ok) throw new Error(d.message);
    commit(d.events);
  };
  for (let round = 1; round <= 3; round++) {
    run({ type: "openRound" } as EngineCommand, { role: "facilitator" });
    run({ type: "sealMove", clientMoveId: `a${round}`, effort: 40 + round } as EngineCommand, {
      role: "seat",
      seatIndex: 0,
    });
    run({ type: "sealMove", clientMoveId: `b${round}`, effort: 55 } as EngineCommand, {
      role: "seat",
      seatIndex: 1,
    });
    if (state.status === "open")
      run({ type: "closeRound" } as EngineCommand, { role: "facilitator" });
  }
  return states;
}

describe("pushed views written once per push", () => {
  const states = playedSession();
  const viewers: Viewer[] = [
    { role: "facilitator", joinCode: "ABC-123" },
    { role: "seat", seatIndex: 0 },
    { role: "seat", seatIndex: 1 },
    { role: "spectator" },
  ];

  it("every patch and full view of a played session encodes to socket.io's own bytes", () => {
    let compared = 0;
    let sharedValues = 0;
    for (let i = 1; i < states.length; i++) {
      // One cache per push, shared by every role's patch, as rooms.ts does.
      const texts: TextCache = new Map();
      for (const viewer of viewers) {
        const before = viewFor(states[i - 1]!, viewer);
        const after = viewFor(states[i]!, viewer);
        const ops = diffJson(before, after);
        const patch = patchPayload(i + 1, i, ops, texts);
        const full = viewPayload(i + 1, after, texts);
        for (const [event, payload] of [
          ["viewPatch", patch],
          ["view", full],
        ] as const) {
          const expected = reference.encode(packet(event, payload));
          expect(ours.encode(packet(event, payload))).toEqual(expected);
          expect(decoded(expected[0] as string)).toEqual([
            event,
            JSON.parse(JSON.stringify(payload)),
          ]);
          compared++;
        }
      }
      sharedValues += texts.size;
    }
    expect(compared).toBeGreaterThan(100);
    // The cache was used: resolved rounds and scenarios are objects shared between roles.
    expect(sharedValues).toBeGreaterThan(0);
  });

  it("a payload without its own text, an ack, or another namespace goes through socket.io's encoder", () => {
    const plain = packet("viewPatch", { seq: 2, base: 1, ops: [] });
    expect(ours.encode(plain)).toEqual(reference.encode(plain));
    const ack = { type: PacketType.ACK, nsp: "/", id: 7, data: [{ ok: true }] };
    expect(ours.encode(ack)).toEqual(reference.encode(ack));
    const other = { ...packet("view", viewPayload(3, {} as RoleView, new Map())), nsp: "/x" };
    expect(ours.encode(other)).toEqual(reference.encode(other));
  });

  it("the text is the payload's: a changed payload is not hidden by an old text", () => {
    // Positive control of the comparison above: a payload whose text disagrees is caught.
    const payload = patchPayload(2, 1, [{ op: "replace", path: "/round", value: 1 }], new Map());
    const tampered = { ...payload, seq: 9 };
    expect(ours.encode(packet("viewPatch", tampered))).toEqual(
      reference.encode(packet("viewPatch", tampered)),
    );
    payload.seq = 9;
    expect(ours.encode(packet("viewPatch", payload))).not.toEqual(
      reference.encode(packet("viewPatch", payload)),
    );
  });
});
