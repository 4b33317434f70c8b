/**
 * A seat's one-line reason (R26) reaches nobody but its own seat before the round resolves:
 * not the facilitator, the big screen, a guest, another seat, nor an export. Positive control:
 * the owner's own traffic holds it, and after the reveal everyone's does.
 */
import { describe, expect, it } from "vitest";
import {
  getWithKey,
  command,
  createSessionOverHttp,
  eventually,
  expectOk,
  hello,
  lastView,
  serverForFile,
  helloEveryRole,
} from "./helpers";
import type { Client } from "./helpers";
import { printShops } from "./fixtures";

const file = serverForFile();
const client = file.client;

// Distinctive words that appear nowhere else in a session's traffic.
const REASON = ["undercut-plan-quokka", "hold-steady-narwhal"] as const;

const everything = (c: Client) => c.received.join("\n");

describe("move reasons stay private until the reveal", () => {
  it("only the owner sees its reason while the round is open; everyone after", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops({ rounds: 2 }));
    const id = created.id;
    const { fac, screen, guest, seats } = await helloEveryRole(client, created, 3);
    expectOk(await command(fac, { type: "openRound" }));
    for (const k of [0, 1]) {
      const seal = { type: "sealMove", clientMoveId: `m${k}`, spend: 20, reason: REASON[k] };
      expectOk(await command(seats[k]!, seal));
    }
    await eventually(() =>
      expect(lastView(screen).seats.map((s) => s.sealed)).toEqual([true, true, false]),
    );
    await eventually(() =>
      expect(lastView(seats[2]!).seats.filter((s) => s.sealed)).toHaveLength(2),
    );
    const base = `${file.server.url}/api/sessions/${id}`;
    const before = [
      await (await getWithKey(`${base}/export`, created.facilitatorKey)).text(),
      await (await getWithKey(`${base}/export?format=csv`, created.facilitatorKey)).text(),
      await (await getWithKey(`${base}/summary`, created.facilitatorKey)).text(),
    ];

    const others: [Client, string][] = [
      [fac, "facilitator"],
      [screen, "spectator"],
      [guest, "guest"],
      [seats[2]!, "seat 2"],
    ];
    for (const [c, who] of others) {
      for (const r of REASON) expect(everything(c).includes(r), `${who} saw ${r}`).toBe(false);
    }
    // positive control: each seat holds its own reason and not the other's
    expect(lastView(seats[0]!).you?.sealedReason).toBe(REASON[0]);
    expect(everything(seats[0]!)).not.toContain(REASON[1]);
    expect(everything(seats[1]!)).toContain(REASON[1]);
    expect(everything(seats[1]!)).not.toContain(REASON[0]);
    for (const text of before) for (const r of REASON) expect(text).not.toContain(r);

    // The reveal: the last seal resolves the round, and every reason is public.
    expectOk(await command(seats[2]!, { type: "sealMove", clientMoveId: "m2", spend: 10 }));
    for (const [c] of others) {
      await eventually(() => expect(lastView(c).rounds).toHaveLength(1));
      for (const r of REASON) expect(everything(c)).toContain(r);
    }
    expect(lastView(fac).rounds[0]!.moveReasons).toEqual([REASON[0], REASON[1], null]);
    const csv = (
      await (await getWithKey(`${base}/export?format=csv`, created.facilitatorKey)).text()
    )
      .trimEnd()
      .split("\r\n");
    expect(csv[0]!.split(",").at(-2)).toBe("moveReason");
    expect(csv.slice(1).map((l) => l.split(",").at(-2))).toEqual([REASON[0], REASON[1], ""]);
  });

  it("a reason must be one line of at most 140 characters", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops({ rounds: 1 }));
    const fac = await client();
    const seat = await client();
    expectOk(
      await hello(fac, { role: "facilitator", sessionId: created.id, key: created.facilitatorKey }),
    );
    expectOk(
      await hello(seat, { role: "seat", sessionId: created.id, key: created.seats[0]!.key }),
    );
    expectOk(await command(fac, { type: "openRound" }));
    const seal = (reason: string) =>
      command(seat, { type: "sealMove", clientMoveId: "x", spend: 5, reason });
    const twoLines = await seal("first line\nsecond line");
    expect(twoLines).toMatchObject({ ok: false, code: "bad-request", path: "reason" });
    const long = await seal("x".repeat(141));
    expect(long).toMatchObject({ ok: false, code: "bad-request", path: "reason" });
    expectOk(await seal(`  ${"y".repeat(140)}  `));
    await eventually(() => expect(lastView(seat).you?.sealedReason).toBe("y".repeat(140)));
  });
});
