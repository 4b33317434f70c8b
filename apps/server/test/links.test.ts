/** issueLinks: a facilitator in any browser can hand out fresh seat and big-screen links. */
import { describe, expect, it } from "vitest";
import type { IssueLinksAckData } from "@contend/protocol";
import { createManualClock } from "../src/clock";
import {
  command,
  createSessionOverHttp,
  eventLog,
  expectOk,
  hello,
  removeDataDir,
  serverForFile,
  startServer,
} from "./helpers";
import { printShops } from "./fixtures";

const clock = createManualClock();
const file = serverForFile({ clock });
const client = file.client;

async function facilitatorOf(sessionId: string, key: string) {
  const f = await client();
  const ack = expectOk(await hello(f, { role: "facilitator", sessionId, key }));
  return { socket: f, view: ack.view };
}

function keyOf(link: string): string {
  return new URLSearchParams(new URL(link).hash.slice(1)).get("key") ?? "";
}

describe("issueLinks over sockets", () => {
  it("the facilitator's view carries the join code; seat and spectator views do not", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops());
    const { view } = await facilitatorOf(created.id, created.facilitatorKey);
    expect(view.joinCode).toBe(created.joinCode);
    const seat = expectOk(
      await hello(await client(), {
        role: "seat",
        sessionId: created.id,
        key: created.seats[0]!.key,
      }),
    );
    expect(seat.view).not.toHaveProperty("joinCode");
    const screen = expectOk(
      await hello(await client(), {
        role: "spectator",
        sessionId: created.id,
        key: created.spectatorKey,
      }),
    );
    expect(screen.view).not.toHaveProperty("joinCode");
  });

  it("issueLinks(seat 1) returns a new seat key that opens seat 1 and seals; the old key is revoked and its holder told", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops({ rounds: 1 }));
    const { socket: f } = await facilitatorOf(created.id, created.facilitatorKey);
    const holder = await client();
    expectOk(
      await hello(holder, { role: "seat", sessionId: created.id, key: created.seats[1]!.key }),
    );
    const told = new Promise<{ reason: string; message: string }>((resolve) =>
      holder.once("revoked", resolve),
    );
    const closed = new Promise<void>((resolve) => holder.once("disconnect", () => resolve()));
    const before = (await eventLog(file.server.db, created.id)).length;
    const data = expectOk(
      await command(f, { type: "issueLinks", seatIndex: 1 }),
    ) as IssueLinksAckData;
    expect(data).toMatchObject({ role: "seat", seatIndex: 1, seq: before });
    expect(data.key).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(data.key).not.toBe(created.seats[1]!.key);
    expect(data.link).toBe(
      `${file.server.url}/seat/${encodeURIComponent(created.id)}#key=${data.key}`,
    );
    expect(keyOf(data.link)).toBe(data.key);
    // no event for a link
    expect(await eventLog(file.server.db, created.id)).toHaveLength(before);
    expect(await told).toMatchObject({
      reason: "new-link",
      message: expect.stringMatching(/new link/),
    });
    await closed;

    const fresh = await client();
    const s = expectOk(await hello(fresh, { role: "seat", sessionId: created.id, key: data.key }));
    expect(s.seatIndex).toBe(1);
    expect(s.view.seats[1]).toMatchObject({ claimed: true });
    const old = await hello(await client(), {
      role: "seat",
      sessionId: created.id,
      key: created.seats[1]!.key,
    });
    expect(old).toMatchObject({ ok: false, code: "unauthorized" });

    expectOk(await command(f, { type: "openRound" }));
    const sealed = expectOk(
      await command(fresh, { type: "sealMove", clientMoveId: "new-link-1", effort: 10 }),
    );
    expect(sealed).toMatchObject({ seatIndex: 1, effort: 10 });
  });

  it("R25: no new link for a seat that has sealed in the open round: its move is neither shown nor replaced", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops({ rounds: 1 }));
    const { socket: f } = await facilitatorOf(created.id, created.facilitatorKey);
    const player = await client();
    expectOk(
      await hello(player, { role: "seat", sessionId: created.id, key: created.seats[0]!.key }),
    );
    expectOk(await command(f, { type: "openRound" }));
    expectOk(await command(player, { type: "sealMove", clientMoveId: "mine", effort: 23.75 }));
    const refused = await command(f, { type: "issueLinks", seatIndex: 0 });
    expect(refused).toMatchObject({
      ok: false,
      code: "wrong-state",
      message: expect.stringMatching(/R25/),
    });
    // the player's key still works and its move stands
    const again = expectOk(
      await hello(await client(), {
        role: "seat",
        sessionId: created.id,
        key: created.seats[0]!.key,
      }),
    );
    expect(again.view.you).toMatchObject({ sealedEffort: 23.75, clientMoveId: "mine" });
    expect(f.received.join("\n")).not.toContain("23.75");
  });

  it("issueLinks(null) returns a spectator key for the big screen, which is no seat key", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops());
    const { socket: f } = await facilitatorOf(created.id, created.facilitatorKey);
    for (const cmd of [{ type: "issueLinks", seatIndex: null }, { type: "issueLinks" }]) {
      const data = expectOk(await command(f, cmd)) as IssueLinksAckData;
      expect(data).toMatchObject({ role: "spectator", seatIndex: null });
      expect(data.link).toBe(
        `${file.server.url}/screen/${encodeURIComponent(created.id)}#key=${data.key}`,
      );
      const screen = expectOk(
        await hello(await client(), { role: "spectator", sessionId: created.id, key: data.key }),
      );
      expect(screen.role).toBe("spectator");
      const asSeat = await hello(await client(), {
        role: "seat",
        sessionId: created.id,
        key: data.key,
      });
      expect(asSeat).toMatchObject({ ok: false, code: "unauthorized" });
    }
  });

  it("a seat, a spectator or a guest sending issueLinks is forbidden and no key is made", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops());
    const seat = await client();
    expectOk(
      await hello(seat, { role: "seat", sessionId: created.id, key: created.seats[0]!.key }),
    );
    const screen = await client();
    expectOk(
      await hello(screen, { role: "spectator", sessionId: created.id, key: created.spectatorKey }),
    );
    const guest = await client();
    expectOk(await hello(guest, { role: "guest", joinCode: created.joinCode }));
    for (const socket of [seat, screen, guest]) {
      for (const cmd of [{ type: "issueLinks", seatIndex: 0 }, { type: "issueLinks" }]) {
        const ack = await command(socket, cmd);
        expect(ack).toMatchObject({ ok: false, code: "forbidden" });
        expect(JSON.stringify(ack)).not.toMatch(/"key"/);
      }
    }
  });

  it("issueLinks for a missing seat is not-found", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops());
    const { socket: f } = await facilitatorOf(created.id, created.facilitatorKey);
    expect(await command(f, { type: "issueLinks", seatIndex: 7 })).toMatchObject({
      ok: false,
      code: "not-found",
      path: "seatIndex",
    });
  });
});

describe("issueLinks with PUBLIC_URL", () => {
  it("links start with the public URL, not the Host the socket used", async () => {
    const other = await startServer({ clock, publicUrl: "https://contest.example.test" });
    try {
      const created = await createSessionOverHttp(other.url, printShops());
      const f = await client(other.url);
      expectOk(
        await hello(f, { role: "facilitator", sessionId: created.id, key: created.facilitatorKey }),
      );
      const data = expectOk(
        await command(f, { type: "issueLinks", seatIndex: 0 }),
      ) as IssueLinksAckData;
      expect(data.link).toBe(
        `https://contest.example.test/seat/${encodeURIComponent(created.id)}#key=${data.key}`,
      );
      f.disconnect();
    } finally {
      await other.stop();
      removeDataDir(other.dataDir);
    }
  });
});
