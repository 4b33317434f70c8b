/** Per-address limits that hold across connections (rate-limiter-flexible), with small budgets. */
import { describe, expect, it } from "vitest";
import { command, createSessionOverHttp, hello, serverForFile } from "./helpers";
import { printShops } from "./fixtures";

const file = serverForFile({
  limits: {
    authFailuresPerIpPerMinute: 5,
    sessionsPerIpPerHour: 3,
    messagesPerIpPerSecond: 60,
    connectionsPerIp: 12,
  },
});

describe("per-address limits", () => {
  it("join codes cannot be guessed at speed: after 5 wrong codes a minute even the right one waits", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops());
    const guest = await file.client();
    const codes: string[] = [];
    for (let i = 0; i < 8; i++) {
      const ack = await hello(guest, { role: "guest", joinCode: `ZZZZ${i}${i}` });
      codes.push(ack.ok ? "ok" : ack.code);
    }
    expect(codes).toEqual([...Array(5).fill("not-found"), ...Array(3).fill("rate-limited")]);
    const right = await hello(guest, { role: "guest", joinCode: created.joinCode });
    expect(right).toMatchObject({ ok: false, code: "rate-limited" });
  });

  it("an address creates at most 3 sessions an hour here (429 after)", async () => {
    const statuses: number[] = [];
    // one already made by the test above
    for (let i = 0; i < 3; i++) {
      const res = await fetch(`${file.server.url}/api/sessions`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify(printShops()),
      });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([201, 201, 429]);
  });

  it("one address holds at most 12 sockets, and its messages share one budget across them", async () => {
    const sockets = await Promise.all(Array.from({ length: 10 }, () => file.client()));
    await expect(Promise.all([file.client(), file.client(), file.client()])).rejects.toThrow(
      /rate-limited/,
    );
    // 10 sockets x 20 messages at once against 60 a second for the address
    const acks = await Promise.all(
      sockets.flatMap((s) => Array.from({ length: 20 }, () => command(s, { type: "pause" }))),
    );
    const limited = acks.filter((a) => !a.ok && /one address/.test(a.message)).length;
    expect(limited).toBeGreaterThanOrEqual(200 - 2 * 60);
  });
});
