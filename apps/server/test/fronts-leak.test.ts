/**
 * A seat's allocation over the fronts (R47) reaches nobody but its own seat before the round
 * resolves: not the facilitator, the big screen, a guest, another seat, an export or the
 * summary. Positive control: the owner's own traffic holds it, and after the reveal everyone's
 * does, per front.
 */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import {
  command,
  createSessionOverHttp,
  eventually,
  expectOk,
  getWithKey,
  helloEveryRole,
  lastView,
  serverForFile,
} from "./helpers";
import type { Client } from "./helpers";

const file = serverForFile();
const roaster = JSON.parse(
  readFileSync(
    new URL("../../../packages/solver/scenarios/roaster-districts.json", import.meta.url),
    "utf8",
  ),
) as Record<string, unknown>;

// Amounts with distinctive cents that appear nowhere else in a session's traffic.
const SECRET = [
  [31337.17, 4242.42, 1717.71, 999.99],
  [5151.15, 2626.62, 3737.73, 808.08],
] as const;
const text = (row: readonly number[]) => row.map(String);
const everything = (c: Client) => c.received.join("\n");

describe("allocations over fronts stay private until the reveal", () => {
  it("only the owner sees its allocation while the round is open; everyone after", async () => {
    const created = await createSessionOverHttp(file.server.url, {
      ...roaster,
      session: { rounds: 2 },
    });
    const { fac, screen, guest, seats } = await helloEveryRole(file.client, created, 3);
    expectOk(await command(fac, { type: "openRound" }));
    for (const k of [0, 1]) {
      const seal = { type: "sealMove", clientMoveId: `m${k}`, frontSpends: SECRET[k] };
      expectOk(await command(seats[k]!, seal));
    }
    await eventually(() =>
      expect(lastView(screen).seats.map((s) => s.sealed)).toEqual([true, true, false]),
    );
    await eventually(() =>
      expect(lastView(seats[2]!).seats.filter((s) => s.sealed)).toHaveLength(2),
    );
    const base = `${file.server.url}/api/sessions/${created.id}`;
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
      for (const row of SECRET) {
        for (const x of text(row)) expect(everything(c).includes(x), `${who} saw ${x}`).toBe(false);
      }
    }
    for (const body of before) {
      for (const row of SECRET) for (const x of text(row)) expect(body).not.toContain(x);
    }
    // positive control: each seat holds its own allocation and not the other's
    expect(lastView(seats[0]!).you?.sealedFrontSpends).toEqual(SECRET[0]);
    for (const x of text(SECRET[0])) expect(everything(seats[0]!)).toContain(x);
    for (const x of text(SECRET[1])) expect(everything(seats[0]!)).not.toContain(x);
    for (const x of text(SECRET[1])) expect(everything(seats[1]!)).toContain(x);

    // The reveal: the last seal resolves the round; every allocation is public, per front.
    const last = { type: "sealMove", clientMoveId: "m2", frontSpends: [5000, 5000, 5000, 5000] };
    expectOk(await command(seats[2]!, last));
    for (const [c] of others) {
      await eventually(() => expect(lastView(c).rounds).toHaveLength(1));
      for (const row of SECRET) for (const x of text(row)) expect(everything(c)).toContain(x);
    }
    const round = lastView(screen).rounds[0]!;
    expect(round.fronts?.spends).toEqual([
      [...SECRET[0]],
      [...SECRET[1]],
      [5000, 5000, 5000, 5000],
    ]);
    expect(lastView(screen).fronts?.fronts).toHaveLength(4);
    // the CSV export: totals in the usual columns, then each front's money, share, best reply
    // and equilibrium money by front name
    const csv = (
      await (await getWithKey(`${base}/export?format=csv`, created.facilitatorKey)).text()
    )
      .trimEnd()
      .split("\r\n")
      .map((line) => line.split(","));
    const header = csv[0]!;
    const col = (name: string) => header.indexOf(name);
    expect(col("spend:Old Town")).toBeGreaterThan(col("roundNote"));
    expect(col("equilibriumSpend:Riverside Park")).toBe(header.length - 1);
    const row0 = csv[1]!;
    expect(Number(row0[col("spend")])).toBeCloseTo(
      SECRET[0].reduce((a, b) => a + b, 0),
      6,
    );
    ["Old Town", "Harbourside", "University Quarter", "Riverside Park"].forEach((name, k) => {
      expect(Number(row0[col(`spend:${name}`)])).toBe(SECRET[0][k]);
      expect(Number(row0[col(`share:${name}`)])).toBeCloseTo(round.fronts!.shares[0]![k]!, 12);
    });
    // the summary reads a fronts round as its total money
    const summary = (await (
      await getWithKey(`${base}/summary`, created.facilitatorKey)
    ).json()) as {
      rounds: { totalSpend: number }[];
    };
    const total = [...SECRET[0], ...SECRET[1], 20000].reduce((a, b) => a + b, 0);
    expect(summary.rounds[0]!.totalSpend).toBeCloseTo(total, 6);
  });

  it("a seal over the budget is refused naming frontSpends; a single spend is refused", async () => {
    const created = await createSessionOverHttp(file.server.url, {
      ...roaster,
      session: { rounds: 1 },
    });
    const { fac, seats } = await helloEveryRole(file.client, created, 3);
    expectOk(await command(fac, { type: "openRound" }));
    const over = await command(seats[2]!, {
      type: "sealMove",
      clientMoveId: "x",
      frontSpends: [5000, 5000, 5000, 5000.01],
    });
    expect(over).toMatchObject({ ok: false, code: "bad-request", path: "frontSpends" });
    const single = await command(seats[2]!, { type: "sealMove", clientMoveId: "y", spend: 10 });
    expect(single).toMatchObject({ ok: false, code: "bad-request", path: "frontSpends" });
    const ok = await command(seats[2]!, {
      type: "sealMove",
      clientMoveId: "z",
      frontSpends: [5000, 5000, 5000, 5000],
    });
    expect(ok).toMatchObject({
      ok: true,
      data: { spend: 20000, frontSpends: [5000, 5000, 5000, 5000] },
    });
  });
});
