import { describe, expect, it } from "vitest";
import {
  command,
  createSessionOverHttp,
  eventually,
  expectOk,
  hello,
  lastView,
  serverForFile,
} from "./helpers";
import type { Client } from "./helpers";
import { printShops } from "./fixtures";

const file = serverForFile();
const client = file.client;

// Distinctive values that appear nowhere else in a session's traffic (keys are base64url,
// ids have no dots, the scenario uses round numbers).
const SECRET = ["37.25", "12.75", "41.5"] as const;

function everything(c: Client): string {
  return c.received.join("\n");
}

describe("sealed moves stay private", () => {
  it("no other client receives a sealed effort before the round resolves, and the export leaves the open round out", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops({ rounds: 2 }));
    const id = created.id;
    const fac = await client();
    const screen = await client();
    const guest = await client();
    const seats = [await client(), await client(), await client()];
    expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
    expectOk(await hello(screen, { role: "spectator", sessionId: id, key: created.spectatorKey }));
    expectOk(await hello(guest, { role: "guest", joinCode: created.joinCode }));
    for (const [i, s] of seats.entries()) {
      expectOk(await hello(s, { role: "seat", sessionId: id, key: created.seats[i]!.key }));
    }
    expectOk(await command(fac, { type: "openRound" }));
    expectOk(
      await command(seats[0]!, { type: "sealMove", clientMoveId: "a", effort: Number(SECRET[0]) }),
    );
    expectOk(
      await command(seats[1]!, { type: "sealMove", clientMoveId: "b", effort: Number(SECRET[1]) }),
    );
    // everyone hears that seats 0 and 1 have sealed
    await eventually(() =>
      expect(lastView(screen).seats.map((s) => s.sealed)).toEqual([true, true, false]),
    );
    await eventually(() =>
      expect(lastView(seats[2]!).seats.filter((s) => s.sealed)).toHaveLength(2),
    );

    const exportBefore = await (await fetch(`${file.server.url}/api/sessions/${id}/export`)).text();
    const csvBefore = await (
      await fetch(`${file.server.url}/api/sessions/${id}/export?format=csv`)
    ).text();

    const others: [Client, string][] = [
      [fac, "facilitator"],
      [screen, "spectator"],
      [guest, "guest"],
      [seats[2]!, "seat 2"],
    ];
    for (const [c, who] of others) {
      for (const secret of SECRET.slice(0, 2)) {
        expect(everything(c).includes(secret), `${who} saw ${secret}`).toBe(false);
      }
    }
    // each seat sees its own effort but not the other's
    expect(everything(seats[0]!)).toContain(SECRET[0]);
    expect(everything(seats[0]!)).not.toContain(SECRET[1]);
    expect(everything(seats[1]!)).toContain(SECRET[1]);
    expect(everything(seats[1]!)).not.toContain(SECRET[0]);
    for (const text of [exportBefore, csvBefore]) {
      for (const secret of SECRET) expect(text).not.toContain(secret);
    }
    expect(JSON.parse(exportBefore).events.map((e: { type: string }) => e.type)).not.toContain(
      "round-opened",
    );

    // After resolution the efforts are public: the same search now finds them.
    expectOk(
      await command(seats[2]!, { type: "sealMove", clientMoveId: "c", effort: Number(SECRET[2]) }),
    );
    await eventually(() => expect(lastView(screen).rounds).toHaveLength(1));
    for (const [c] of others) {
      await eventually(() => expect(lastView(c).rounds).toHaveLength(1));
      for (const secret of SECRET) expect(everything(c)).toContain(secret);
    }
    const exportAfter = await (await fetch(`${file.server.url}/api/sessions/${id}/export`)).text();
    for (const secret of SECRET) expect(exportAfter).toContain(secret);
  });
});
