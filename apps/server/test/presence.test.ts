/**
 * Presence: the facilitator learns which seats have a connected page (docs/protocol.md 11.2).
 * Real server, real sockets; nobody but the facilitator receives it.
 */
import { describe, expect, it } from "vitest";
import { createSessionOverHttp, eventually, expectOk, hello, serverForFile } from "./helpers";
import type { Client } from "./helpers";
import { printShops } from "./fixtures";

const file = serverForFile();

/** every presence list this client received, in order */
function presenceLists(c: Client): number[][] {
  return c.received
    .map((text) => JSON.parse(text) as [string, { seats?: number[] }])
    .filter(([event]) => event === "presence")
    .map(([, msg]) => msg.seats ?? []);
}

describe("seat presence for the facilitator", () => {
  it("lists the seats with a connected page, follows connects and disconnects, and goes to nobody else", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops({ rounds: 1 }));
    const fac = await file.client();
    expectOk(
      await hello(fac, { role: "facilitator", sessionId: created.id, key: created.facilitatorKey }),
    );
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([]));

    const seatKey = (i: number) => created.seats[i]!.key as string;
    const seat2 = await file.client();
    expectOk(await hello(seat2, { role: "seat", sessionId: created.id, key: seatKey(2) }));
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([2]));

    const seat0 = await file.client();
    expectOk(await hello(seat0, { role: "seat", sessionId: created.id, key: seatKey(0) }));
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([0, 2]));

    // a second page of the same seat changes nothing; closing one of the two keeps it present
    const seat0b = await file.client();
    expectOk(await hello(seat0b, { role: "seat", sessionId: created.id, key: seatKey(0) }));
    const countBefore = presenceLists(fac).length;
    seat0b.disconnect();
    seat2.disconnect();
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([0]));
    expect(presenceLists(fac).length).toBe(countBefore + 1);

    // a facilitator arriving later gets the current list with its hello
    const fac2 = await file.client();
    expectOk(
      await hello(fac2, {
        role: "facilitator",
        sessionId: created.id,
        key: created.facilitatorKey,
      }),
    );
    await eventually(() => expect(presenceLists(fac2).at(-1)).toEqual([0]));

    seat0.disconnect();
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([]));

    // seats and the big screen never receive it (the positive control is the facilitator above)
    const screen = await file.client();
    expectOk(
      await hello(screen, { role: "spectator", sessionId: created.id, key: created.spectatorKey }),
    );
    const seat1 = await file.client();
    expectOk(await hello(seat1, { role: "seat", sessionId: created.id, key: seatKey(1) }));
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([1]));
    expect(presenceLists(screen)).toEqual([]);
    expect(presenceLists(seat1)).toEqual([]);
  });
});
