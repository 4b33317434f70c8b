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
} from "./helpers";
import { printShops } from "./fixtures";

const file = serverForFile();

describe("R27 over the socket", () => {
  it("the facilitator notes a round after the session ended; views and the CSV carry it", async () => {
    const created = await createSessionOverHttp(file.server.url, printShops({ rounds: 1 }));
    const id = created.id;
    const fac = await file.client();
    const seat = await file.client();
    expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
    expectOk(await hello(seat, { role: "seat", sessionId: id, key: created.seats[0]!.key }));
    expectOk(await command(fac, { type: "openRound" }));
    expectOk(await command(fac, { type: "closeRound" }));
    await eventually(() => expect(lastView(fac).status).toBe("ended"));
    const refused = await command(seat, { type: "noteRound", round: 1, text: "seat note" });
    expect(refused).toMatchObject({ ok: false, code: "forbidden" });
    const note = "Inkwell Press opened high and never came back down";
    expectOk(await command(fac, { type: "noteRound", round: 1, text: note }));
    await eventually(() => expect(lastView(seat).rounds[0]!.note).toBe(note));
    const csv = await (
      await getWithKey(
        `${file.server.url}/api/sessions/${id}/export?format=csv`,
        created.facilitatorKey,
      )
    ).text();
    const lines = csv.trimEnd().split("\r\n");
    expect(lines[0]!.split(",").at(-1)).toBe("roundNote");
    expect(lines.slice(1).every((l) => l.endsWith(`,${note}`))).toBe(true);
  });
});
