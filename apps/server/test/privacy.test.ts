/**
 * Private by default: what an outsider, a participant and an export may see. Leak checks use
 * the method of leak.test.ts: distinctive values searched for in every frame and export, with
 * a positive control (the same search finds them where they are allowed).
 */
import { describe, expect, it } from "vitest";
import {
  command,
  createSessionOverHttp,
  eventually,
  expectOk,
  getWithKey,
  hello,
  lastView,
  serverForFile,
} from "./helpers";
import type { Client } from "./helpers";
import { printShops } from "./fixtures";

const file = serverForFile();

// The computer seat's fixed effort (on the 0.25 grid, so it is played as it is), matched as a
// whole JSON number so that longer numbers that start with the same digits do not count.
const FIXED = 13.25;
const FIXED_RE = /(?<![\d.])13\.25(?![\d])/;

function everything(c: Client): string {
  return c.received.join("\n");
}

describe("nobody reads a session without a key for it", () => {
  it("list and export answer 401 without a key; a seat or screen key, or another session's facilitator key, gets the answer of an unknown id", async () => {
    const url = file.server.url;
    const a = await createSessionOverHttp(url, printShops());
    const b = await createSessionOverHttp(url, printShops());
    expect((await fetch(`${url}/api/sessions`)).status).toBe(401);
    expect((await fetch(`${url}/api/sessions/${a.id}/export`)).status).toBe(401);
    expect((await fetch(`${url}/api/sessions/${a.id}/export?format=csv`)).status).toBe(401);
    const unknown = await getWithKey(
      `${url}/api/sessions/no-such-session/export`,
      b.facilitatorKey,
    );
    const unknownBody = await unknown.text();
    for (const key of [a.spectatorKey, a.seats[0]!.key!, b.facilitatorKey]) {
      const res = await getWithKey(`${url}/api/sessions/${a.id}/export`, key);
      expect(res.status).toBe(unknown.status);
      expect(await res.text()).toBe(unknownBody);
    }
    expect(unknown.status).toBe(404);
    // positive control: its own facilitator key opens it
    expect((await getWithKey(`${url}/api/sessions/${a.id}/export`, a.facilitatorKey)).status).toBe(
      200,
    );
  });

  it("POST /api/sessions/mine lists exactly the sessions whose facilitator keys are sent", async () => {
    const url = file.server.url;
    const a = await createSessionOverHttp(url, printShops());
    const b = await createSessionOverHttp(url, printShops());
    const res = await fetch(`${url}/api/sessions/mine`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({
        sessions: [
          { id: a.id, key: a.facilitatorKey },
          { id: b.id, key: b.spectatorKey },
          { id: b.id, key: a.facilitatorKey },
        ],
      }),
    });
    expect(res.status).toBe(200);
    expect(((await res.json()) as { id: string }[]).map((s) => s.id)).toEqual([a.id]);
  });
});

describe("hidden until revealed, for computers too (R23)", () => {
  it("no participant and no export sees a computer seat's policy or the seed before the session ends; the facilitator does", async () => {
    const url = file.server.url;
    const created = await createSessionOverHttp(
      url,
      printShops({ rounds: 1, computer: { "Cobble Copy": { kind: "fixed", effort: FIXED } } }),
    );
    const id = created.id;
    const fac = await file.client();
    const screen = await file.client();
    const guest = await file.client();
    const seats = [await file.client(), await file.client()];
    expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
    expectOk(await hello(screen, { role: "spectator", sessionId: id, key: created.spectatorKey }));
    expectOk(await hello(guest, { role: "guest", joinCode: created.joinCode }));
    for (const [i, s] of seats.entries()) {
      expectOk(await hello(s, { role: "seat", sessionId: id, key: created.seats[i]!.key }));
    }
    expectOk(await command(fac, { type: "openRound" }));
    await eventually(() => expect(lastView(screen).seats[2]!.sealed).toBe(true));
    const exported = await (
      await getWithKey(`${url}/api/sessions/${id}/export`, created.facilitatorKey)
    ).text();
    const record = JSON.parse(exported) as {
      events: { type: string; seed?: number; seats?: { policy: unknown }[] }[];
      withheld?: string[];
    };

    for (const [c, who] of [
      [screen, "spectator"],
      [guest, "guest"],
      [seats[0]!, "seat 0"],
      [seats[1]!, "seat 1"],
    ] as const) {
      expect(FIXED_RE.test(everything(c)), `${who} saw the computer's effort`).toBe(false);
      expect(everything(c).includes('"fixed"'), `${who} saw the computer's policy`).toBe(false);
    }
    expect(exported).not.toMatch(FIXED_RE);
    expect(exported).not.toContain('"fixed"');
    const createdEvent = record.events.find((e) => e.type === "session-created")!;
    expect(createdEvent.seed).toBe(0);
    expect(createdEvent.seats!.map((s) => s.policy)).toEqual([null, null, null]);
    expect(record.withheld).toEqual(expect.arrayContaining(["computer policies", "session seed"]));
    // positive control: the facilitator's view holds its own computer settings
    expect(everything(fac)).toMatch(FIXED_RE);

    // once the session has ended, everything is public to whoever may export it
    expectOk(await command(seats[0]!, { type: "sealMove", clientMoveId: "a", effort: 5 }));
    expectOk(await command(seats[1]!, { type: "sealMove", clientMoveId: "b", effort: 5 }));
    await eventually(() => expect(lastView(screen).status).toBe("ended"));
    const after = await (
      await getWithKey(`${url}/api/sessions/${id}/export`, created.facilitatorKey)
    ).text();
    expect(after).toMatch(FIXED_RE);
    expect(JSON.parse(after)).not.toHaveProperty("withheld");
    expect(everything(screen)).toMatch(FIXED_RE);
  });

  it("a rival added by a shock with a computer policy: its policy reaches the facilitator only", async () => {
    const url = file.server.url;
    const created = await createSessionOverHttp(url, printShops({ rounds: 2 }));
    const id = created.id;
    const fac = await file.client();
    const screen = await file.client();
    const seat = await file.client();
    expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
    expectOk(await hello(screen, { role: "spectator", sessionId: id, key: created.spectatorKey }));
    expectOk(await hello(seat, { role: "seat", sessionId: id, key: created.seats[0]!.key }));
    expectOk(
      await command(fac, {
        type: "applyShock",
        changes: [
          {
            target: "add-rival",
            rival: { name: "Quire and Quill", cost: 1 },
            policy: { kind: "fixed", effort: FIXED },
          },
        ],
      }),
    );
    await eventually(() => expect(lastView(screen).shocks).toHaveLength(1));
    await eventually(() => expect(lastView(seat).shocks).toHaveLength(1));
    const exported = await (
      await getWithKey(`${url}/api/sessions/${id}/export`, created.facilitatorKey)
    ).text();
    for (const [text, who] of [
      [everything(screen), "spectator"],
      [everything(seat), "seat"],
      [exported, "export"],
    ] as const) {
      expect(FIXED_RE.test(text), `${who} saw the added computer's effort`).toBe(false);
    }
    expect(everything(fac)).toMatch(FIXED_RE); // positive control
  });

  it("winner-draw seeds stay out of participants' views until the session ends (the session seed could be searched out of one)", async () => {
    const created = await createSessionOverHttp(
      file.server.url,
      printShops({ rounds: 2, outcome: "winner" }),
    );
    const id = created.id;
    const fac = await file.client();
    const screen = await file.client();
    const seats = [await file.client(), await file.client(), await file.client()];
    expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
    expectOk(await hello(screen, { role: "spectator", sessionId: id, key: created.spectatorKey }));
    for (const [i, s] of seats.entries()) {
      expectOk(await hello(s, { role: "seat", sessionId: id, key: created.seats[i]!.key }));
    }
    expectOk(await command(fac, { type: "openRound" }));
    for (const [i, s] of seats.entries()) {
      expectOk(await command(s, { type: "sealMove", clientMoveId: `m${i}`, effort: 5 }));
    }
    await eventually(() => expect(lastView(screen).rounds).toHaveLength(1));
    const drawSeed = lastView(fac).rounds[0]!.drawSeed;
    expect(drawSeed).not.toBeNull(); // positive control: the facilitator has it
    expect(lastView(screen).rounds[0]!.drawSeed).toBeNull();
    expect(lastView(seats[0]!).rounds[0]!.drawSeed).toBeNull();
    expect(lastView(screen).rounds[0]!.winner).not.toBeNull();
  });
});

describe("abuse limits", () => {
  it("a seat seals at most 30 moves in a round, however many connections it uses", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops({ rounds: 1 }));
    const fac = await file.client();
    expectOk(
      await hello(fac, { role: "facilitator", sessionId: created.id, key: created.facilitatorKey }),
    );
    expectOk(await command(fac, { type: "openRound" }));
    const conns = await Promise.all(Array.from({ length: 4 }, () => file.client()));
    for (const c of conns) {
      expectOk(await hello(c, { role: "seat", sessionId: created.id, key: created.seats[0]!.key }));
    }
    let accepted = 0;
    let limited = 0;
    for (let i = 0; i < 40; i++) {
      const ack = await command(conns[i % 4]!, {
        type: "sealMove",
        clientMoveId: `m${i}`,
        effort: (i % 8) + 1,
      });
      if (ack.ok) accepted++;
      else if (ack.code === "rate-limited") limited++;
    }
    expect(accepted).toBe(30);
    expect(limited).toBe(10);
  });

  it("POST without application/json is 415 (a cross-site form cannot create sessions)", async () => {
    for (const headers of [{}, { "content-type": "text/plain" }] as Record<string, string>[]) {
      const res = await fetch(`${file.server.url}/api/sessions`, {
        method: "POST",
        headers,
        body: JSON.stringify(printShops()),
      });
      expect(res.status).toBe(415);
    }
  });

  it("API answers carry nosniff, no-referrer and a policy that forbids framing", async () => {
    const res = await fetch(`${file.server.url}/api/health`);
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("referrer-policy")).toBe("no-referrer");
    expect(res.headers.get("content-security-policy")).toMatch(/frame-ancestors 'none'/);
    expect(res.headers.get("x-frame-options")).toBe("DENY");
  });
});
