/**
 * Bad text at every boundary: names and ids with NUL, lone surrogates, control characters and
 * reserved keys, over REST and sockets. Each is refused as bad-request (or not-found for an id
 * that names nothing); none is an internal error, and nothing is written.
 */
import { describe, expect, it } from "vitest";
import { mulberry32 } from "@contend/solver";
import {
  command,
  createSessionOverHttp,
  eventLog,
  expectOk,
  FLOOD_LIMITS,
  hello,
  request,
  serverForFile,
} from "./helpers";
import { printShops } from "./fixtures";

// generous limits, so that the flood reaches validation
const file = serverForFile({ limits: FLOOD_LIMITS });

const BAD_PIECES = [
  "\u0000",
  "\ud800",
  "\udfff",
  "\u0007",
  "\u001b[31m",
  "\u007f",
  "\u0085",
  "\n",
] as const;
const RESERVED = ["__proto__", "constructor", "prototype"] as const;

/** A bad string: a reserved word, or ordinary text with a bad piece somewhere inside. */
function badText(rng: () => number): string {
  if (rng() < 0.25) return RESERVED[Math.floor(rng() * RESERVED.length)]!;
  const piece = BAD_PIECES[Math.floor(rng() * BAD_PIECES.length)]!;
  const at = Math.floor(rng() * 4);
  return "Rival".slice(0, at) + piece + "Rival".slice(at);
}

/** Socket.io's JSON would keep these; so does fetch with a hand-made body. */
function rawJson(value: unknown): string {
  return JSON.stringify(value);
}

describe("the text rule at the boundary", () => {
  it("a rival named __proto__ is refused with the field named (it used to make every openRound internal)", async () => {
    const body = printShops();
    body.rivals[0]!.name = "__proto__";
    const res = await fetch(`${file.server.url}/api/sessions`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: rawJson(body),
    });
    expect(res.status).toBe(400);
    expect(await res.json()).toMatchObject({
      error: { code: "bad-request", path: "rivals.0.name" },
    });
  });

  it("fuzz: 300 bad names and ids over REST and sockets give 0 internal errors and change nothing", async () => {
    const url = file.server.url;
    const created = await createSessionOverHttp(url, printShops());
    const fac = await file.client();
    expectOk(
      await hello(fac, { role: "facilitator", sessionId: created.id, key: created.facilitatorKey }),
    );
    const seat = await file.client();
    expectOk(
      await hello(seat, { role: "seat", sessionId: created.id, key: created.seats[0]!.key! }),
    );
    expectOk(await command(fac, { type: "openRound" }));
    const guest = await file.client();
    const before = await eventLog(file.server.db, created.id);
    const sessionsBefore = (await file.server.db.sessions.list()).length;

    const rng = mulberry32(16);
    const codes = new Map<string, number>();
    const count = (code: string) => codes.set(code, (codes.get(code) ?? 0) + 1);
    for (let i = 0; i < 300; i++) {
      const bad = badText(rng);
      const kind = i % 10;
      if (kind === 0) {
        const body = printShops();
        body.title = bad;
        const res = await fetch(`${url}/api/sessions`, {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: rawJson(body),
        });
        count(String(res.status));
      } else if (kind === 1) {
        const body = printShops();
        body.rivals[1]!.name = bad;
        const res = await fetch(`${url}/api/sessions`, {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: rawJson(body),
        });
        count(String(res.status));
      } else if (kind === 2) {
        const res = await fetch(
          `${url}/api/sessions/${encodeURIComponent(bad.replace(/[\ud800-\udfff]/g, "%ED%A0%80"))}/export`,
          { headers: { authorization: `Bearer ${created.facilitatorKey}` } },
        );
        count(String(res.status));
      } else if (kind === 3) {
        const ack = await hello(guest, { role: "guest", joinCode: `AB${bad}CD` });
        count(ack.ok ? "ok" : ack.code);
      } else if (kind === 4) {
        const ack = await hello(guest, {
          role: "seat",
          sessionId: bad,
          key: created.seats[1]!.key,
        });
        count(ack.ok ? "ok" : ack.code);
      } else if (kind === 5) {
        const ack = await hello(guest, {
          role: "seat",
          sessionId: created.id,
          key: created.seats[1]!.key,
          displayName: bad,
        });
        count(ack.ok ? "ok" : ack.code);
      } else if (kind === 6) {
        const ack = await command(seat, { type: "sealMove", clientMoveId: bad, effort: 1 });
        count(ack.ok ? "ok" : ack.code);
      } else if (kind === 7) {
        const ack = await command(fac, {
          type: "applyShock",
          changes: [{ target: "add-rival", rival: { name: bad, cost: 1 } }],
        });
        count(ack.ok ? "ok" : ack.code);
      } else if (kind === 8) {
        const ack = await request(
          fac,
          "command",
          JSON.parse(`{"type":"pause","${bad === "__proto__" ? "__proto__" : "constructor"}":{}}`),
        );
        count(ack.ok ? "ok" : ack.code);
      } else {
        const ack = await command(guest, { type: "claimSeat", seatIndex: 1, displayName: bad });
        count(ack.ok ? "ok" : ack.code);
      }
    }
    expect(codes.get("internal") ?? 0).toBe(0);
    expect(codes.get("500") ?? 0).toBe(0);
    expect(codes.get("ok") ?? 0).toBe(0);
    expect(codes.get("201") ?? 0).toBe(0);
    // every refusal is one of the expected answers
    expect([...codes.keys()].sort()).toEqual(expect.arrayContaining(["400", "bad-request"]));
    for (const code of codes.keys()) {
      expect(["400", "404", "bad-request", "not-found", "unauthorized"]).toContain(code);
    }
    expect(await eventLog(file.server.db, created.id)).toEqual(before);
    expect((await file.server.db.sessions.list()).length).toBe(sessionsBefore);
  });
});
