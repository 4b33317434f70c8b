/**
 * Presence across two server processes' worth of applications on one PostgreSQL: the
 * facilitator's list names the seats with a page open on either process, follows connects and
 * disconnects on the other one, reaches a facilitator who joins later on either, drops a
 * process that stops repeating its list, and still goes to nobody but facilitators.
 */
import { describe, expect, it } from "vitest";
import { createManualClock } from "../src/clock";
import { PRESENCE_EXPIRY_MS, PRESENCE_REFRESH_MS } from "../src/socket/presence";
import { createSessionOverHttp, eventually, expectOk, hello } from "./helpers";
import type { Client } from "./helpers";
import { printShops } from "./fixtures";
import { serversOnOnePostgres, TEST_DATABASE_URL } from "./pgDatabase";

/** every presence list this client received, in order */
function presenceLists(c: Client): number[][] {
  return c.received
    .map((text) => JSON.parse(text) as [string, { seats?: number[] }])
    .filter(([event]) => event === "presence")
    .map(([, msg]) => msg.seats ?? []);
}

describe.skipIf(!TEST_DATABASE_URL)("seat presence across processes", () => {
  const clock = createManualClock();
  const { server, client } = serversOnOnePostgres({ clock });

  it("the facilitator sees the seats connected to either process", async () => {
    const a = await server();
    const b = await server();
    const created = await createSessionOverHttp(a.url, printShops({ rounds: 1 }));
    const id = created.id;
    const seatKey = (i: number) => created.seats[i]!.key as string;
    const fac = await client(a);
    expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([]));

    // a seat on the other process
    const seat1 = await client(b);
    expectOk(await hello(seat1, { role: "seat", sessionId: id, key: seatKey(1) }));
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([1]));
    // and one on the facilitator's own
    const seat0 = await client(a);
    expectOk(await hello(seat0, { role: "seat", sessionId: id, key: seatKey(0) }));
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([0, 1]));

    // a facilitator joining later on the other process gets both, from each process's count
    const facB = await client(b);
    expectOk(
      await hello(facB, { role: "facilitator", sessionId: id, key: created.facilitatorKey }),
    );
    await eventually(() => expect(presenceLists(facB).at(-1)).toEqual([0, 1]));

    // seat 1 closes its page on B: both facilitators hear it
    seat1.disconnect();
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([0]));
    await eventually(() => expect(presenceLists(facB).at(-1)).toEqual([0]));

    // the same seat open on both processes stays present while either page is
    const seat0b = await client(b);
    expectOk(await hello(seat0b, { role: "seat", sessionId: id, key: seatKey(0) }));
    seat0.disconnect();
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([0]));
    seat0b.disconnect();
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([]));

    // seats and the big screen never receive it (the positive control is the facilitators)
    const screen = await client(b);
    expectOk(await hello(screen, { role: "spectator", sessionId: id, key: created.spectatorKey }));
    const seat2 = await client(b);
    expectOk(await hello(seat2, { role: "seat", sessionId: id, key: seatKey(2) }));
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([2]));
    for (const c of [screen, seat2, seat0, seat0b, seat1]) expect(presenceLists(c)).toEqual([]);
  });

  it("a process that stops repeating its list (killed) drops out of the others' lists", async () => {
    const a = await server();
    const created = await createSessionOverHttp(a.url, printShops({ rounds: 1 }));
    const id = created.id;
    const fac = await client(a);
    expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
    // a process that told once and then went silent (as one killed without closing its sockets)
    await a.app.hub.publish({ kind: "presence", from: "gone", sessionId: id, seats: [2] });
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([2]));
    // still there before the expiry
    clock.advance(PRESENCE_EXPIRY_MS - PRESENCE_REFRESH_MS);
    expect(presenceLists(fac).at(-1)).toEqual([2]);
    clock.advance(PRESENCE_REFRESH_MS);
    await eventually(() => expect(presenceLists(fac).at(-1)).toEqual([]));
  });
});
