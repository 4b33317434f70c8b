/** Who may send what: the protocol's COMMAND_ROLES table, enforced by the socket layer and the engine alike. */
import { describe, expect, it } from "vitest";
import {
  command,
  createSessionOverHttp,
  eventLog,
  expectOk,
  hello,
  serverForFile,
} from "./helpers";
import { printShops } from "./fixtures";

const file = serverForFile();

describe("COMMAND_ROLES at the socket", () => {
  it("R3/R6: a seat may claim its own seat (no new key, no event) but never another seat", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops());
    const seat = await file.client();
    const key = created.seats[0]!.key!;
    expectOk(await hello(seat, { role: "seat", sessionId: created.id, key, displayName: "Ana" }));
    const before = await eventLog(file.server.db, created.id);
    const own = await command(seat, { type: "claimSeat", seatIndex: 0, displayName: "Ana" });
    expect(own).toMatchObject({
      ok: true,
      data: { sessionId: created.id, seatIndex: 0, seatKey: key },
    });
    const other = await command(seat, { type: "claimSeat", seatIndex: 1, displayName: "Ana" });
    expect(other).toMatchObject({
      ok: false,
      code: "forbidden",
      message: expect.stringMatching(/R3/),
    });
    expect(await eventLog(file.server.db, created.id)).toEqual(before);
  });
});
