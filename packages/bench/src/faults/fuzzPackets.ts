/**
 * The fuzz run's message generator: hellos and packets built from a seeded stream, mixing
 * valid commands with weird numbers, wrong types and broken JSON.
 */
import type { CreatedSession } from "../api";

export interface FuzzIdentity {
  sessionId: string | null;
  hello: string;
}

const WEIRD_NUMBERS = [
  "NaN",
  "Infinity",
  "-Infinity",
  "1e400",
  "-1e400",
  "1e308",
  "-1",
  "-0",
  "1e12",
  "1e13",
  "0.5",
  "9007199254740993",
  "null",
  '"12"',
  "[]",
  "{}",
  "true",
];
// endSession is left out: one legit hit ends a fuzzed session and the rest of the run would only
// meet wrong-state; ending is covered by the crash run.
const COMMAND_TYPES = [
  "openRound",
  "closeRound",
  "applyShock",
  "pause",
  "resume",
  "setSeatPolicy",
  "sealMove",
  "claimSeat",
  "hello",
  "",
  "__proto__",
  "constructor",
  "x".repeat(300),
];

/** One fuzzed packet: text, and whether it carries an ack id we should wait for. */
export function fuzzPacket(
  random: () => number,
  ctx: { sessions: CreatedSession[] },
): { text: string; kind: string; hello?: FuzzIdentity } {
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(random() * xs.length)]!;
  const num = () => pick(WEIRD_NUMBERS);
  const s = pick(ctx.sessions);
  const roll = random();
  if (roll < 0.05)
    return {
      kind: "malformed",
      text: pick([
        "42[",
        "42{}",
        "4",
        "99",
        "42",
        '42["command"',
        "421abc",
        "40",
        "41",
        "6",
        '452-["command",{"_placeholder":true,"num":0}]',
        "\u0000",
      ]),
    };
  if (roll < 0.07)
    return {
      kind: "oversized",
      text: `42["command",{"type":"sealMove","clientMoveId":"${"y".repeat(70_000)}","effort":1}]`,
    };
  if (roll < 0.1)
    return { kind: "no-ack", text: `42["command",{"type":"${pick(COMMAND_TYPES)}"}]` };
  let body: string;
  const type = pick(COMMAND_TYPES);
  const field = random();
  if (field < 0.3)
    body = `{"type":"sealMove","clientMoveId":${pick(['"m"', '""', "1", "null", `"${"z".repeat(65)}"`])},"effort":${num()}${random() < 0.5 ? `,"round":${num()}` : ""}}`;
  else if (field < 0.45) body = `{"type":"openRound","durationSeconds":${num()}}`;
  else if (field < 0.55)
    body = `{"type":"applyShock","changes":[{"target":"${pick(["rival", "prize", "csf", "add-rival", "retire-rival", "moon"])}","index":${num()},"field":"${pick(["cost", "value", "budget", "weight", "decisiveness", "__proto__"])}","value":${num()}}]}`;
  else if (field < 0.65)
    body = `{"type":"setSeatPolicy","seatIndex":${num()},"policy":${pick(["null", '{"kind":"equilibrium"}', '{"kind":"nope"}', "1"])}}`;
  else if (field < 0.75)
    body = `{"type":"claimSeat","seatIndex":${num()},"displayName":${pick(['"Ann"', '""', "null", `"${"n".repeat(100)}"`])}}`;
  else if (field < 0.8) body = `{"__proto__":{"polluted":true},"type":"${type}"}`;
  else if (field < 0.85)
    body = JSON.stringify({
      type,
      extra: num(),
      nested: JSON.parse('{"a":{"b":{"c":[1,2,{"d":null}]}}}'),
    });
  else if (field < 0.9) body = `[${num()},${num()}]`;
  else body = `{"type":"${type}"}`;
  const event =
    random() < 0.9
      ? "command"
      : pick(["hello", "view", "", "connect", "disconnect", "x".repeat(500)]);
  void s;
  if (event === "hello") {
    // a second hello on the same socket switches its identity when it succeeds
    const hello = fuzzHello(random, ctx);
    return { kind: "event:hello", text: `42{ID}["hello",${hello.hello}]`, hello };
  }
  return {
    kind: event === "command" ? "command" : `event:${event.slice(0, 12)}`,
    text: `42{ID}[${JSON.stringify(event)},${body}]`,
  };
}

export function fuzzHello(random: () => number, ctx: { sessions: CreatedSession[] }): FuzzIdentity {
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(random() * xs.length)]!;
  const a = pick(ctx.sessions);
  const b = pick(ctx.sessions);
  const seat = pick(a.seats);
  const roll = random();
  const cred = (role: string, sessionId: string, key: string) =>
    `{"protocol":1,"credentials":{"role":"${role}","sessionId":"${sessionId}","key":"${key}"}}`;
  if (roll < 0.25) return { sessionId: a.id, hello: cred("seat", a.id, seat.key!) };
  if (roll < 0.4) return { sessionId: a.id, hello: cred("facilitator", a.id, a.facilitatorKey) };
  if (roll < 0.5)
    return { sessionId: null, hello: cred("seat", b.id === a.id ? "nope" : b.id, seat.key!) };
  if (roll < 0.6) return { sessionId: null, hello: cred("facilitator", a.id, seat.key!) };
  if (roll < 0.7)
    return {
      sessionId: null,
      hello: `{"protocol":${pick(["2", "0", "NaN", '"1"', "1e400"])},"credentials":{"role":"seat","sessionId":"${a.id}","key":"${seat.key}"}}`,
    };
  if (roll < 0.8)
    return {
      sessionId: null,
      hello: `{"protocol":1,"credentials":{"role":"${pick(["admin", "guest", "", "system"])}","sessionId":"${a.id}","key":"${"k".repeat(200)}","joinCode":${pick(['"AAAA"', "1", '"x"'])}}}`,
    };
  return {
    sessionId: null,
    hello: pick([
      "null",
      "1",
      '"hello"',
      "[]",
      `{"protocol":1}`,
      `{"protocol":1,"credentials":{"role":"seat","sessionId":"${"s".repeat(70)}","key":"k"}}`,
    ]),
  };
}
