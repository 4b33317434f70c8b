/**
 * The library of sessions over REST: rename, tags, archive, search and delete, and who may do
 * them (a facilitator key of that session or the operator key; any other key gets the answer
 * of an unknown id, docs/security.md).
 */
import { describe, expect, it } from "vitest";
import { hashKey } from "@contend/db";
import { sessionListItemSchema, sessionListSchema, sessionSummarySchema } from "@contend/protocol";
import { createSessionOverHttp, getWithKey, serverForFile } from "./helpers";
import { printShops } from "./fixtures";

const OPERATOR_KEY = "operator-key-for-the-library-tests";
const file = serverForFile({ operatorKeyDigest: Buffer.from(hashKey(OPERATOR_KEY), "hex") });

function patch(id: string, body: unknown, key?: string) {
  return fetch(`${file.server.url}/api/sessions/${encodeURIComponent(id)}`, {
    method: "PATCH",
    headers: {
      "content-type": "application/json",
      ...(key ? { authorization: `Bearer ${key}` } : {}),
    },
    body: JSON.stringify(body),
  });
}

function remove(id: string, key: string) {
  return fetch(`${file.server.url}/api/sessions/${encodeURIComponent(id)}`, {
    method: "DELETE",
    headers: { authorization: `Bearer ${key}` },
  });
}

function mine(sessions: { id: string; key: string }[], filter?: unknown) {
  return fetch(`${file.server.url}/api/sessions/mine`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(filter === undefined ? { sessions } : { sessions, filter }),
  });
}

async function errorOf(res: Response) {
  return ((await res.json()) as { error: { code: string; path: string; message: string } }).error;
}

const word = () => `w${Math.random().toString(36).slice(2, 8)}`;

describe("editing a session's library entry", () => {
  it("the facilitator renames, tags and archives; the list item comes back", async () => {
    const s = await createSessionOverHttp(file.server.url, printShops());
    const res = await patch(
      s.id,
      { title: "  Poster contract, Q3 drill ", addTags: [" Q3 ", "Board  Review"] },
      s.facilitatorKey,
    );
    expect(res.status).toBe(200);
    const item = sessionListItemSchema.parse(await res.json());
    expect(item).toMatchObject({
      id: s.id,
      title: "Poster contract, Q3 drill",
      tags: ["q3", "board review"],
      archivedAt: null,
      endedAt: null,
    });
    const archived = sessionListItemSchema.parse(
      await (await patch(s.id, { archived: true, removeTags: ["q3"] }, s.facilitatorKey)).json(),
    );
    expect(archived.tags).toEqual(["board review"]);
    expect(Date.parse(archived.archivedAt!)).not.toBeNaN();
    // the summary carries the library's title and tags
    const summary = sessionSummarySchema.parse(
      await (
        await getWithKey(`${file.server.url}/api/sessions/${s.id}/summary`, s.facilitatorKey)
      ).json(),
    );
    expect(summary.session).toMatchObject({
      title: "Poster contract, Q3 drill",
      tags: ["board review"],
    });
  });

  it("the operator key may edit any session", async () => {
    const s = await createSessionOverHttp(file.server.url, printShops());
    const res = await patch(s.id, { addTags: ["operator"] }, OPERATOR_KEY);
    expect(res.status).toBe(200);
    expect(((await res.json()) as { tags: string[] }).tags).toEqual(["operator"]);
  });

  it("a seat key, the screen key and another session's facilitator key cannot rename, tag, archive or delete: the answer of an unknown id, and nothing changes", async () => {
    const a = await createSessionOverHttp(file.server.url, printShops());
    const b = await createSessionOverHttp(file.server.url, printShops());
    const unknownPatch = await patch("no-such-session", { title: "Taken" }, b.facilitatorKey);
    const unknownPatchBody = await unknownPatch.text();
    const unknownDelete = await remove("no-such-session", b.facilitatorKey);
    const unknownDeleteBody = await unknownDelete.text();
    expect(unknownPatch.status).toBe(404);
    expect(unknownDelete.status).toBe(404);
    for (const key of [a.seats[0]!.key!, a.seats[1]!.key!, a.spectatorKey, b.facilitatorKey]) {
      for (const body of [{ title: "Taken" }, { addTags: ["x"] }, { archived: true }]) {
        const res = await patch(a.id, body, key);
        expect(res.status).toBe(404);
        expect(await res.text()).toBe(unknownPatchBody);
      }
      const del = await remove(a.id, key);
      expect(del.status).toBe(404);
      expect(await del.text()).toBe(unknownDeleteBody);
    }
    expect((await patch(a.id, { title: "Taken" })).status).toBe(401);
    const untouched = await file.server.db.library.entry(a.id);
    expect(untouched).toMatchObject({ title: printShops().title, tags: [], archivedAt: null });
    // positive control: the session's own facilitator key deletes it
    expect((await remove(a.id, a.facilitatorKey)).status).toBe(204);
    expect(await file.server.db.sessions.get(a.id)).toBeNull();
  });

  it("bad edits answer 400 naming the field", async () => {
    const s = await createSessionOverHttp(file.server.url, printShops());
    const cases: [unknown, string][] = [
      [{}, ""],
      [{ title: "   " }, "title"],
      [{ title: "two\nlines" }, "title"],
      [{ addTags: ["a,b"] }, "addTags.0"],
      [{ addTags: ["ok", "x".repeat(33)] }, "addTags.1"],
      [{ addTags: ["same"], removeTags: ["Same"] }, "addTags.0"],
      [{ archived: "yes" }, "archived"],
      [{ colour: "red" }, "colour"],
    ];
    for (const [body, path] of cases) {
      const res = await patch(s.id, body, s.facilitatorKey);
      expect(res.status, JSON.stringify(body)).toBe(400);
      const error = await errorOf(res);
      expect(error.path, JSON.stringify(body)).toBe(path);
      expect(error.code).toBe("bad-request");
    }
    const twenty = Array.from({ length: 20 }, (_, i) => `t${i}`);
    expect((await patch(s.id, { addTags: twenty }, s.facilitatorKey)).status).toBe(200);
    const full = await patch(s.id, { addTags: ["one more"] }, s.facilitatorKey);
    expect(full.status).toBe(400);
    expect(await errorOf(full)).toMatchObject({ path: "addTags" });
  });
});

describe("searching the library", () => {
  it("the operator searches every session by title, tag and dates; archived ones only when asked", async () => {
    const w = word();
    const url = file.server.url;
    const q3 = await createSessionOverHttp(url, printShops());
    const q4 = await createSessionOverHttp(url, printShops());
    await patch(q3.id, { title: `Poster ${w} Q3`, addTags: ["q3"] }, q3.facilitatorKey);
    await patch(q4.id, { title: `Poster ${w} Q4`, addTags: ["q4"], archived: true }, OPERATOR_KEY);
    await file.server.db.prisma.session.update({
      where: { id: q3.id },
      data: { createdAt: new Date("2026-07-01T10:00:00Z") },
    });
    const list = async (query: string) => {
      const res = await getWithKey(`${url}/api/sessions?${query}`, OPERATOR_KEY);
      expect(res.status, query).toBe(200);
      return sessionListSchema.parse(await res.json()).map((s) => s.id);
    };
    expect(await list(`q=${w}`)).toEqual([q3.id]);
    expect(await list(`q=${w}&archived=all`)).toEqual(expect.arrayContaining([q3.id, q4.id]));
    expect(await list(`q=${w}&archived=only`)).toEqual([q4.id]);
    expect(await list(`q=${w}&archived=all&tag=Q4`)).toEqual([q4.id]);
    expect(await list(`q=${w}&createdTo=2026-07-02T00:00:00Z`)).toEqual([q3.id]);
    expect(await list(`q=${w}&archived=all&createdFrom=2026-07-02T00:00:00Z`)).toEqual([q4.id]);
    expect(await list(`q=${w}&endedFrom=2026-01-01T00:00:00Z`)).toEqual([]);

    const bad = await getWithKey(
      `${url}/api/sessions?createdFrom=2026-07-02T00:00:00Z&createdTo=2026-07-01T00:00:00Z`,
      OPERATOR_KEY,
    );
    expect(bad.status).toBe(400);
    expect(await errorOf(bad)).toMatchObject({ path: "createdTo" });
    const badDate = await getWithKey(`${url}/api/sessions?endedFrom=yesterday`, OPERATOR_KEY);
    expect(await errorOf(badDate)).toMatchObject({ path: "endedFrom" });
  });

  it("a browser searches only the sessions whose facilitator keys it sends", async () => {
    const w = word();
    const url = file.server.url;
    const mineA = await createSessionOverHttp(url, printShops());
    const mineB = await createSessionOverHttp(url, printShops());
    const notMine = await createSessionOverHttp(url, printShops());
    for (const s of [mineA, mineB, notMine]) {
      await patch(s.id, { title: `Drill ${w}`, addTags: ["drill"] }, s.facilitatorKey);
    }
    await patch(mineB.id, { archived: true }, mineB.facilitatorKey);
    const held = [
      { id: mineA.id, key: mineA.facilitatorKey },
      { id: mineB.id, key: mineB.facilitatorKey },
      { id: notMine.id, key: notMine.seats[0]!.key! },
    ];
    const ids = async (filter?: unknown) => {
      const res = await mine(held, filter);
      expect(res.status).toBe(200);
      return sessionListSchema.parse(await res.json()).map((s) => s.id);
    };
    expect(await ids()).toEqual([mineA.id]);
    expect((await ids({ q: w, tag: "drill", archived: "all" })).sort()).toEqual(
      [mineA.id, mineB.id].sort(),
    );
    expect(await ids({ archived: "only" })).toEqual([mineB.id]);
    const bad = await mine(held, { tag: "a,b" });
    expect(bad.status).toBe(400);
    expect(await errorOf(bad)).toMatchObject({ path: "filter.tag" });
  });
});
