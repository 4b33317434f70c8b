/**
 * Per-address limits over two server processes' worth of applications on one PostgreSQL: the
 * budgets for sessions created and failed keys are counted in the database, so an address
 * spreading its attempts over both processes gets the stated budget once, not once a process.
 */
import { describe, expect, it } from "vitest";
import { hello } from "./helpers";
import { printShops } from "./fixtures";
import { serversOnOnePostgres, TEST_DATABASE_URL } from "./pgDatabase";

describe.skipIf(!TEST_DATABASE_URL)("per-address limits across processes", () => {
  const { server, client } = serversOnOnePostgres({
    limits: { sessionsPerIpPerHour: 2, authFailuresPerIpPerMinute: 3 },
  });

  async function createOn(url: string) {
    const res = await fetch(`${url}/api/sessions`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(printShops()),
    });
    return res.status;
  }

  it("an address creates at most 2 sessions an hour over both processes, and fails 3 keys a minute", async () => {
    const a = await server();
    const b = await server();
    // one on each process is the whole budget: the next is refused on either
    expect([await createOn(a.url), await createOn(b.url)]).toEqual([201, 201]);
    expect([await createOn(a.url), await createOn(b.url)]).toEqual([429, 429]);

    // wrong join codes, alternating between the processes: three in all, then refused unread
    const guestA = await client(a);
    const guestB = await client(b);
    const codes: string[] = [];
    for (const [guest, i] of [
      [guestA, 1],
      [guestB, 2],
      [guestA, 3],
      [guestB, 4],
      [guestA, 5],
    ] as const) {
      const ack = await hello(guest, { role: "guest", joinCode: `ZZZZ${i}${i}` });
      codes.push(ack.ok ? "ok" : ack.code);
    }
    expect(codes).toEqual(["not-found", "not-found", "not-found", "rate-limited", "rate-limited"]);
  });
});
