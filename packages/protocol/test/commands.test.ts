import { describe, expect, it } from "vitest";
import { COMMAND_ROLES, LIMITS, parseCommand } from "../src/index";

const valid: unknown[] = [
  { type: "openRound" },
  { type: "openRound", durationSeconds: 60 },
  { type: "openRound", durationSeconds: null },
  { type: "closeRound" },
  { type: "applyShock", changes: [{ target: "prize", value: 150 }] },
  {
    type: "applyShock",
    changes: [
      { target: "rival", index: 1, field: "cost", value: 0.8 },
      { target: "rival", index: 2, field: "budget", value: null },
      { target: "csf", csf: { kind: "logit", scale: 0.05 } },
      { target: "add-rival", rival: { name: "Dough Bros", cost: 1.2 } },
      {
        target: "add-rival",
        rival: { name: "Flour Power", cost: 1 },
        policy: { kind: "best-reply" },
      },
      { target: "retire-rival", index: 0 },
    ],
  },
  { type: "pause" },
  { type: "resume" },
  { type: "endSession" },
  { type: "setSeatPolicy", seatIndex: 2, policy: { kind: "fictitious-play" } },
  { type: "setSeatPolicy", seatIndex: 2, policy: null },
  { type: "sealMove", clientMoveId: "m-1", effort: 12 },
  { type: "sealMove", clientMoveId: "m-1", effort: 0, round: 3 },
  { type: "claimSeat", seatIndex: 0, displayName: "Ana" },
  { type: "issueLinks", seatIndex: 1 },
  { type: "issueLinks", seatIndex: null },
  { type: "issueLinks" },
  { type: "noteRound", round: 2, text: "Both teams held back after the prize rose" },
  { type: "noteRound", round: 1, text: "" },
];

describe("parseCommand", () => {
  it("parseCommand(each valid example) returns it", () => {
    for (const cmd of valid) {
      const r = parseCommand(cmd);
      expect(r, JSON.stringify(cmd)).toMatchObject({ ok: true });
    }
  });

  it("COMMAND_ROLES names a role for every command type", () => {
    const types = new Set(valid.map((c) => (c as { type: string }).type));
    expect(new Set(Object.keys(COMMAND_ROLES))).toEqual(types);
  });

  const invalid: [string, unknown, string][] = [
    ["unknown type", { type: "cheat" }, "type"],
    ["missing type", { effort: 1 }, "type"],
    ["NaN effort", { type: "sealMove", clientMoveId: "a", effort: NaN }, "effort"],
    ["Infinity effort", { type: "sealMove", clientMoveId: "a", effort: Infinity }, "effort"],
    ["negative effort", { type: "sealMove", clientMoveId: "a", effort: -1 }, "effort"],
    ["huge effort", { type: "sealMove", clientMoveId: "a", effort: 1e13 }, "effort"],
    ["string effort", { type: "sealMove", clientMoveId: "a", effort: "5" }, "effort"],
    ["empty clientMoveId", { type: "sealMove", clientMoveId: "", effort: 1 }, "clientMoveId"],
    [
      "long clientMoveId",
      { type: "sealMove", clientMoveId: "x".repeat(65), effort: 1 },
      "clientMoveId",
    ],
    [
      "seat index smuggled into sealMove",
      { type: "sealMove", clientMoveId: "a", effort: 1, seatIndex: 2 },
      "seatIndex",
    ],
    ["round 0", { type: "sealMove", clientMoveId: "a", effort: 1, round: 0 }, "round"],
    ["clock too short", { type: "openRound", durationSeconds: 1 }, "durationSeconds"],
    ["extra field on closeRound", { type: "closeRound", reason: "clock" }, "reason"],
    ["no changes", { type: "applyShock", changes: [] }, "changes"],
    [
      "unknown shock target",
      { type: "applyShock", changes: [{ target: "weather" }] },
      "changes.0.target",
    ],
    [
      "unknown rival field",
      { type: "applyShock", changes: [{ target: "rival", index: 0, field: "name", value: 1 }] },
      "changes.0.field",
    ],
    [
      "NaN shock value",
      { type: "applyShock", changes: [{ target: "rival", index: 0, field: "cost", value: NaN }] },
      "changes.0.value",
    ],
    [
      "huge prize",
      { type: "applyShock", changes: [{ target: "prize", value: 1e300 }] },
      "changes.0.value",
    ],
    [
      "seat index 64",
      { type: "applyShock", changes: [{ target: "retire-rival", index: 64 }] },
      "changes.0.index",
    ],
    [
      "bad csf",
      {
        type: "applyShock",
        changes: [{ target: "csf", csf: { kind: "ratio", decisiveness: 50 } }],
      },
      "changes.0.csf.decisiveness",
    ],
    [
      "bad new rival",
      { type: "applyShock", changes: [{ target: "add-rival", rival: { name: "", cost: 1 } }] },
      "changes.0.rival.name",
    ],
    [
      "bad policy",
      { type: "setSeatPolicy", seatIndex: 0, policy: { kind: "overspender", noise: 2 } },
      "policy.noise",
    ],
    ["negative seat", { type: "setSeatPolicy", seatIndex: -1, policy: null }, "seatIndex"],
    ["issueLinks for a negative seat", { type: "issueLinks", seatIndex: -1 }, "seatIndex"],
    ["issueLinks with a role", { type: "issueLinks", role: "facilitator" }, "role"],
    ["fractional seat", { type: "claimSeat", seatIndex: 1.5, displayName: "Bo" }, "seatIndex"],
    ["blank display name", { type: "claimSeat", seatIndex: 0, displayName: "   " }, "displayName"],
    [
      "long display name",
      { type: "claimSeat", seatIndex: 0, displayName: "x".repeat(41) },
      "displayName",
    ],
  ];

  for (const [what, cmd, path] of invalid) {
    it(`parseCommand(${what}) is bad-request naming ${path}`, () => {
      const r = parseCommand(cmd);
      expect(r).toMatchObject({ ok: false, code: "bad-request", path });
      if (!r.ok) expect(r.message.startsWith(`${path}: `)).toBe(true);
    });
  }

  it("parseCommand(201 changes) is refused; 200 are accepted", () => {
    const change = { target: "prize", value: 100 };
    const ok = parseCommand({ type: "applyShock", changes: Array(LIMITS.changesMax).fill(change) });
    expect(ok.ok).toBe(true);
    const tooMany = parseCommand({
      type: "applyShock",
      changes: Array(LIMITS.changesMax + 1).fill(change),
    });
    expect(tooMany).toMatchObject({ ok: false, path: "changes" });
  });

  it("parseCommand(non-object) is refused", () => {
    for (const x of [null, undefined, 5, "sealMove", []]) {
      expect(parseCommand(x)).toMatchObject({ ok: false, code: "bad-request" });
    }
  });

  it("COMMAND_ROLES keeps issueLinks for the facilitator", () => {
    expect(COMMAND_ROLES.issueLinks).toEqual(["facilitator"]);
  });

  it("parseCommand trims display names", () => {
    const r = parseCommand({ type: "claimSeat", seatIndex: 0, displayName: "  Ana  " });
    expect(r.ok && r.value).toEqual({ type: "claimSeat", seatIndex: 0, displayName: "Ana" });
  });
});
