import { describe, expect, it } from "vitest";
import {
  command,
  createSessionOverHttp,
  eventually,
  expectOk,
  getWithKey,
  lastView,
  serverForFile,
  helloEveryRole,
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
    const { fac, screen, guest, seats } = await helloEveryRole(client, created, 3);
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

    const exportUrl = `${file.server.url}/api/sessions/${id}/export`;
    const exportBefore = await (await getWithKey(exportUrl, created.facilitatorKey)).text();
    const csvBefore = await (
      await getWithKey(`${exportUrl}?format=csv`, created.facilitatorKey)
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
    const exportAfter = await (await getWithKey(exportUrl, created.facilitatorKey)).text();
    for (const secret of SECRET) expect(exportAfter).toContain(secret);
  });
});

// Private numbers (docs/protocol.md R40-R41): true numbers no other value of this session equals.
const TRUE_COST = 1.3125;
const TRUE_VALUE = 87.4375;
const shows = (text: string, x: number) =>
  new RegExp(`(^|[^\\d.])${String(x).replace(".", "\\.")}($|[^\\d])`).test(text);

describe("private costs and values stay private until the session ends", () => {
  it("no seat but the owner, no screen, guest or export sees the truth; the facilitator does; after the end everyone does", async () => {
    const scenario = printShops({
      rounds: 2,
      hidden: {
        truth: "scenario",
        rivals: {
          "Foxglove Prints": { cost: { dist: "uniform", low: 1, high: 1.75 } },
          "Cobble Copy": { value: { dist: "triangular", low: 60, mode: 90, high: 120 } },
        },
      },
    });
    scenario.rivals[1]!.cost = TRUE_COST;
    (scenario.rivals[2] as { value?: number }).value = TRUE_VALUE;
    const created = await createSessionOverHttp(file.server.url, scenario);
    const id = created.id;
    const { fac, screen, guest, seats } = await helloEveryRole(client, created, 3);
    const exportNow = () =>
      fetch(`${file.server.url}/api/sessions/${id}/export`, {
        headers: { authorization: `Bearer ${created.facilitatorKey}` },
      });
    expectOk(await command(fac, { type: "openRound" }));
    expectOk(await command(seats[0]!, { type: "sealMove", clientMoveId: "a", spend: 20 }));
    expectOk(await command(seats[1]!, { type: "sealMove", clientMoveId: "b", spend: 15 }));
    expectOk(await command(fac, { type: "closeRound" }));
    await eventually(() => expect(lastView(screen).hidden?.rounds).toHaveLength(1));
    await eventually(() => expect(lastView(seats[0]!).hidden?.rounds).toHaveLength(1));

    const before = await exportNow();
    expect(before.status).toBe(409);
    const beforeText = await before.text();
    const csv = await (
      await fetch(`${file.server.url}/api/sessions/${id}/export?format=csv`, {
        headers: { authorization: `Bearer ${created.facilitatorKey}` },
      })
    ).text();
    const summaryBefore = await fetch(`${file.server.url}/api/sessions/${id}/summary`, {
      headers: { authorization: `Bearer ${created.facilitatorKey}` },
    });
    expect(summaryBefore.status).toBe(409);
    const blind: [string, string][] = [
      ["summary", await summaryBefore.text()],
      ["spectator", everything(screen)],
      ["guest", everything(guest)],
      ["seat 0", everything(seats[0]!)],
      ["export", beforeText],
      ["csv export", csv],
    ];
    for (const [who, text] of blind) {
      expect(shows(text, TRUE_COST), `${who} saw the cost`).toBe(false);
      expect(shows(text, TRUE_VALUE), `${who} saw the value`).toBe(false);
    }
    // each owner sees its own number and not the other's
    expect(shows(everything(seats[1]!), TRUE_COST)).toBe(true);
    expect(shows(everything(seats[1]!), TRUE_VALUE)).toBe(false);
    expect(shows(everything(seats[2]!), TRUE_VALUE)).toBe(true);
    expect(shows(everything(seats[2]!), TRUE_COST)).toBe(false);
    // positive control: the same search finds both in the facilitator's frames
    expect(shows(everything(fac), TRUE_COST)).toBe(true);
    expect(shows(everything(fac), TRUE_VALUE)).toBe(true);

    expectOk(await command(fac, { type: "endSession" }));
    for (const c of [screen, guest, seats[0]!]) {
      await eventually(() => expect(lastView(c).status).toBe("ended"));
      expect(shows(everything(c), TRUE_COST)).toBe(true);
      expect(shows(everything(c), TRUE_VALUE)).toBe(true);
    }
    const after = await exportNow();
    expect(after.status).toBe(200);
    const afterText = await after.text();
    const summaryAfter = await fetch(`${file.server.url}/api/sessions/${id}/summary`, {
      headers: { authorization: `Bearer ${created.facilitatorKey}` },
    });
    expect(summaryAfter.status).toBe(200);
    expect(shows(afterText, TRUE_COST)).toBe(true);
    expect(shows(afterText, TRUE_VALUE)).toBe(true);
  });
});
