import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sessionFilterSchema } from "@contend/protocol";
import type { SessionFilterInput } from "@contend/protocol";
import { newKey, openDatabase, type Database } from "../src/index";
import { nextTags } from "../src/repos/library";
import { backends } from "./backends";
import { resolved, sessionInput } from "./fixtures";

/** session-ended as the server writes it */
const ended = (at: number) => ({ type: "session-ended", at, payload: { reason: "facilitator" } });

const filter = (input: SessionFilterInput = {}) => sessionFilterSchema.parse(input);
const NOW = new Date("2026-12-04T12:00:00.000Z");

describe("nextTags (pure)", () => {
  it("keeps order, drops the removed, adds each new tag once", () => {
    expect(nextTags(["q3", "board"], ["drill", "q3", "drill"], ["board"])).toEqual(["q3", "drill"]);
    expect(nextTags([], [], ["absent"])).toEqual([]);
  });
});

describe.each(backends)("library of sessions on $name", (backend) => {
  let db: Database;
  let dispose: () => Promise<void>;
  /** a word no other test's titles contain, so searches see only this suite's sessions */
  const word = `w${Math.random().toString(36).slice(2, 8)}`;

  beforeAll(async () => {
    const fresh = await backend.fresh();
    dispose = fresh.dispose;
    db = await openDatabase({ url: fresh.url });
  });
  afterAll(async () => {
    await db?.close();
    await dispose?.();
  });

  async function session(title: string, createdAt?: Date) {
    const { input } = sessionInput({ title });
    expect((await db.sessions.create(input)).ok).toBe(true);
    if (createdAt) {
      await db.prisma.session.update({ where: { id: input.id }, data: { createdAt } });
    }
    return input.id;
  }

  it("a new session has no tags, is not archived, has not ended and resolved no round", async () => {
    const id = await session(`Fresh ${word}`);
    expect(await db.library.entry(id)).toMatchObject({
      id,
      tags: [],
      archivedAt: null,
      endedAt: null,
      rounds: 0,
    });
    expect((await db.sessions.get(id))?.tags).toEqual([]);
  });

  it("update renames, tags and archives without touching the last activity", async () => {
    const id = await session(`Rename me ${word}`);
    const before = (await db.sessions.get(id))!.updatedAt;
    const r = await db.library.update(
      id,
      { title: `Harbour drill ${word}`, addTags: ["q3", "board"], archived: true },
      NOW,
    );
    expect(r).toMatchObject({
      ok: true,
      entry: { title: `Harbour drill ${word}`, tags: ["q3", "board"], archivedAt: NOW },
    });
    const again = await db.library.update(id, { removeTags: ["q3"], archived: true }, new Date());
    // archiving an archived session keeps the first date
    expect(again).toMatchObject({ ok: true, entry: { tags: ["board"], archivedAt: NOW } });
    const back = await db.library.update(id, { archived: false }, NOW);
    expect(back).toMatchObject({ ok: true, entry: { archivedAt: null } });
    expect((await db.sessions.get(id))!.updatedAt).toEqual(before);
  });

  it("update of an unknown session is not-found; too many tags are refused and nothing changes", async () => {
    expect(await db.library.update("no-such-session", { title: "X" }, NOW)).toEqual({
      ok: false,
      code: "not-found",
    });
    const id = await session(`Crowded ${word}`);
    const twenty = Array.from({ length: 20 }, (_, i) => `t${i}`);
    expect((await db.library.update(id, { addTags: twenty }, NOW)).ok).toBe(true);
    expect(await db.library.update(id, { addTags: ["one more"], title: "Changed" }, NOW)).toEqual({
      ok: false,
      code: "too-many-tags",
      count: 21,
    });
    expect(await db.library.entry(id)).toMatchObject({ title: `Crowded ${word}`, tags: twenty });
  });

  it("two tag edits at once both land (the row is locked while tags are rewritten)", async () => {
    const id = await session(`Busy ${word}`);
    await Promise.all([
      db.library.update(id, { addTags: ["alpha"] }, NOW),
      db.library.update(id, { addTags: ["beta"] }, NOW),
    ]);
    expect([...(await db.library.entry(id))!.tags].sort()).toEqual(["alpha", "beta"]);
  });

  it("search finds by title text (case-insensitive, wildcards literal) and by tag", async () => {
    const a = await session(`Kiosk LEASE ${word} 100%`);
    const b = await session(`Airport slots ${word}`);
    await db.library.update(b, { addTags: ["airport", "q4"] }, NOW);
    const ids = async (f: SessionFilterInput) =>
      (await db.library.search(filter(f))).map((e) => e.id);

    expect(await ids({ q: `kiosk lease ${word}` })).toEqual([a]);
    expect(await ids({ q: `${word} 100%` })).toEqual([a]);
    expect(await ids({ q: `${word} 1_0` })).toEqual([]);
    expect(await ids({ q: word, tag: "q4" })).toEqual([b]);
    expect(await ids({ q: word, tag: "missing" })).toEqual([]);
  });

  it("search by created and ended ranges; a running session never matches an ended range", async () => {
    const word = `d${Math.random().toString(36).slice(2, 8)}`;
    const early = await session(`Early ${word}`, new Date("2026-01-10T09:00:00Z"));
    const late = await session(`Late ${word}`, new Date("2026-06-10T09:00:00Z"));
    const endedAt = Date.parse("2026-06-11T10:00:00Z");
    expect((await db.events.append(late, 1, [ended(endedAt)])).ok).toBe(true);
    const ids = async (f: SessionFilterInput) =>
      (await db.library.search(filter({ q: word, ...f }))).map((e) => e.id).sort();

    expect(await ids({ createdFrom: "2026-06-01T00:00:00Z" })).toEqual([late]);
    expect(await ids({ createdTo: "2026-02-01T00:00:00Z" })).toEqual([early]);
    expect(
      await ids({ createdFrom: "2026-01-10T09:00:00Z", createdTo: "2026-01-10T09:00:00Z" }),
    ).toEqual([early]);
    expect(
      await ids({ endedFrom: "2026-06-11T00:00:00Z", endedTo: "2026-06-12T00:00:00Z" }),
    ).toEqual([late]);
    expect(await ids({ endedTo: "2026-06-11T09:59:59Z" })).toEqual([]);
    expect((await db.library.entry(late))?.endedAt).toEqual(new Date(endedAt));
  });

  it("archived sessions are hidden unless asked for; ids limit the search", async () => {
    const word = `a${Math.random().toString(36).slice(2, 8)}`;
    const kept = await session(`Kept ${word}`);
    const shelved = await session(`Shelved ${word}`);
    await db.library.update(shelved, { archived: true }, NOW);
    const ids = async (f: SessionFilterInput, only?: string[]) =>
      (await db.library.search(filter({ q: word, ...f }), only)).map((e) => e.id);

    expect(await ids({})).toContain(kept);
    expect(await ids({})).not.toContain(shelved);
    expect(await ids({ archived: "only" })).toEqual([shelved]);
    expect(await ids({ archived: "all" })).toEqual(expect.arrayContaining([kept, shelved]));
    expect(await ids({ archived: "all" }, [shelved])).toEqual([shelved]);
    expect(await ids({ archived: "all" }, [])).toEqual([]);
  });

  it("entries count resolved rounds", async () => {
    const id = await session(`Played ${word}`);
    await db.events.append(id, 1, [resolved(1), resolved(2)]);
    expect((await db.library.entry(id))?.rounds).toBe(2);
  });
});

describe.each(backends)("saved scenarios on $name", (backend) => {
  let db: Database;
  let dispose: () => Promise<void>;
  beforeAll(async () => {
    const fresh = await backend.fresh();
    dispose = fresh.dispose;
    db = await openDatabase({ url: fresh.url });
  });
  afterAll(async () => {
    await db?.close();
    await dispose?.();
  });

  const body = (prize: number) => ({
    title: "Kiosk lease",
    prize,
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: [
      { name: "North Bakery", cost: 1 },
      { name: "Harbour Bakery", cost: 0.1 + 0.2 },
    ],
  });

  it("create stores version 1; addVersion numbers on; versions list newest first", async () => {
    const id = `sc-${Math.random().toString(36).slice(2)}`;
    const key = newKey();
    expect(
      await db.scenarios.create({ id, name: "Kiosk drill", key, note: "Q3", body: body(100) }),
    ).toEqual({ ok: true, version: 1 });
    expect(await db.scenarios.addVersion(id, "Q4 numbers", body(120))).toEqual({
      ok: true,
      version: 2,
    });
    const saved = await db.scenarios.get(id);
    expect(saved).toMatchObject({ id, name: "Kiosk drill" });
    expect(saved?.versions.map((v) => [v.version, v.note])).toEqual([
      [2, "Q4 numbers"],
      [1, "Q3"],
    ]);
    // bodies come back exactly, doubles bit for bit
    expect((await db.scenarios.version(id, 1))?.body).toEqual(body(100));
    expect((await db.scenarios.version(id, 2))?.body).toEqual(body(120));
    expect(await db.scenarios.version(id, 3)).toBeNull();
  });

  it("versions saved at once get distinct numbers", async () => {
    const id = `sc-${Math.random().toString(36).slice(2)}`;
    await db.scenarios.create({ id, name: "Race", key: newKey(), note: "", body: body(1) });
    const results = await Promise.all(
      [2, 3, 4].map((p) => db.scenarios.addVersion(id, "", body(p))),
    );
    const numbers = results.map((r) => (r.ok ? r.version : 0)).sort();
    expect(numbers).toEqual([2, 3, 4]);
  });

  it("the key opens only its own scenario; addVersion to an unknown id is not-found", async () => {
    const a = `sc-${Math.random().toString(36).slice(2)}`;
    const b = `sc-${Math.random().toString(36).slice(2)}`;
    const keyA = newKey();
    await db.scenarios.create({ id: a, name: "A", key: keyA, note: "", body: body(1) });
    await db.scenarios.create({ id: b, name: "B", key: newKey(), note: "", body: body(1) });
    expect(await db.scenarios.keyOpens(a, keyA)).toBe(true);
    expect(await db.scenarios.keyOpens(b, keyA)).toBe(false);
    expect(await db.scenarios.keyOpens(a, newKey())).toBe(false);
    expect(await db.scenarios.addVersion("sc-missing", "", body(1))).toEqual({
      ok: false,
      code: "not-found",
    });
    const stored = await db.prisma.savedScenario.findUnique({ where: { id: a } });
    expect(JSON.stringify(stored)).not.toContain(keyA);
  });

  it("a taken id is a conflict; list limits to ids; delete removes every version", async () => {
    const id = `sc-${Math.random().toString(36).slice(2)}`;
    await db.scenarios.create({ id, name: "One", key: newKey(), note: "", body: body(1) });
    expect(
      await db.scenarios.create({ id, name: "Two", key: newKey(), note: "", body: body(1) }),
    ).toEqual({ ok: false, code: "conflict", field: "id" });
    expect((await db.scenarios.list([id])).map((s) => s.name)).toEqual(["One"]);
    expect(await db.scenarios.list([])).toEqual([]);
    expect((await db.scenarios.list()).map((s) => s.id)).toContain(id);
    expect(await db.scenarios.delete(id)).toBe(true);
    expect(await db.scenarios.delete(id)).toBe(false);
    expect(await db.scenarios.get(id)).toBeNull();
    expect(await db.prisma.savedScenarioVersion.count({ where: { scenarioId: id } })).toBe(0);
  });
});
