import { afterEach, describe, expect, it, vi } from "vitest";
import { sessionFilterSchema } from "@contend/protocol";
import type { SessionListItem } from "@contend/protocol";
import {
  apiFilter,
  dayInstant,
  EMPTY_FILTER,
  listKeyedSessions,
  renameScenario,
} from "../src/lib/libraryApi";

describe("the library filter sent to the server", () => {
  it("a day range covers the whole of both local days", () => {
    const from = new Date(dayInstant("2026-03-02", false)!);
    const to = new Date(dayInstant("2026-03-04", true)!);
    expect([from.getFullYear(), from.getMonth(), from.getDate(), from.getHours()]).toEqual([
      2026, 2, 2, 0,
    ]);
    expect([to.getDate(), to.getHours(), to.getMinutes(), to.getMilliseconds()]).toEqual([
      4, 23, 59, 999,
    ]);
    expect(dayInstant("", false)).toBeUndefined();
    expect(dayInstant("2026-3-2", false)).toBeUndefined();
  });

  it("names the range after the chosen date and passes the protocol's filter schema", () => {
    const f = apiFilter({
      ...EMPTY_FILTER,
      q: " tender ",
      tag: "q3",
      dateOf: "ended",
      from: "2026-01-01",
      to: "2026-01-31",
    });
    expect(Object.keys(f).sort()).toEqual(["archived", "endedFrom", "endedTo", "q", "tag"]);
    expect(f.q).toBe("tender");
    const parsed = sessionFilterSchema.safeParse(f);
    expect(parsed.success).toBe(true);
    expect(apiFilter(EMPTY_FILTER)).toEqual({ archived: "hide" });
  });
});

describe("listKeyedSessions: the list both the library and the compare page load", () => {
  const item = (id: string) => ({ id, title: id, tags: [] }) as unknown as SessionListItem;
  const calls: { url: string; init?: RequestInit }[] = [];
  const answer = (data: unknown, status = 200) =>
    vi.fn(async (url: string, init?: RequestInit) => {
      calls.push({ url, init });
      return new Response(JSON.stringify(data), { status });
    });
  afterEach(() => {
    vi.unstubAllGlobals();
    calls.length = 0;
  });

  it("lists nothing and asks nothing when no key is held and no operator key is given", async () => {
    vi.stubGlobal("fetch", answer([item("s1")]));
    expect(await listKeyedSessions("", [])).toEqual({ ok: true, data: [] });
    expect(calls).toHaveLength(0);
  });

  it("pairs each of this browser's sessions with its own facilitator key", async () => {
    vi.stubGlobal("fetch", answer([item("s2"), item("s1")]));
    const held = [
      { id: "s1", key: "k1" },
      { id: "s2", key: "k2" },
    ];
    const r = await listKeyedSessions("", held);
    expect(r.ok && r.data.map((d) => [d.item.id, d.key])).toEqual([
      ["s2", "k2"],
      ["s1", "k1"],
    ]);
    expect(calls[0]!.url).toBe("/api/sessions/mine");
    expect(JSON.parse(String(calls[0]!.init?.body))).toEqual({ sessions: held });
  });

  it("with the operator key: every session carries that key; a filter makes it a search", async () => {
    vi.stubGlobal("fetch", answer([item("s9")]));
    const r = await listKeyedSessions("op", [{ id: "s9", key: "k9" }], EMPTY_FILTER);
    expect(r.ok && r.data.map((d) => d.key)).toEqual(["op"]);
    expect(calls[0]!.url).toBe("/api/sessions?archived=hide");
    expect(new Headers(calls[0]!.init?.headers).get("authorization")).toBe("Bearer op");
  });

  it("passes a refusal on as a value", async () => {
    vi.stubGlobal("fetch", answer({ error: { code: "unauthorised", message: "wrong key" } }, 401));
    const r = await listKeyedSessions("bad", []);
    expect(!r.ok && r.status).toBe(401);
  });
});

describe("renameScenario", () => {
  afterEach(() => vi.unstubAllGlobals());

  it("sends PATCH with the name and the key in the header only; a refusal names the field", async () => {
    const calls: { url: string; init?: RequestInit }[] = [];
    vi.stubGlobal(
      "fetch",
      vi.fn(async (url: string, init?: RequestInit) => {
        calls.push({ url, init });
        return new Response(
          JSON.stringify({
            error: { code: "bad-request", path: "name", message: "name: must not be empty" },
          }),
          { status: 400 },
        );
      }),
    );
    const r = await renameScenario("a/b", "lib-key", "");
    expect(calls[0]!.url).toBe("/api/scenarios/a%2Fb");
    expect(calls[0]!.init?.method).toBe("PATCH");
    expect(new Headers(calls[0]!.init?.headers).get("authorization")).toBe("Bearer lib-key");
    expect(JSON.parse(String(calls[0]!.init?.body))).toEqual({ name: "" });
    expect(r).toMatchObject({ ok: false, status: 400, path: "name" });
  });
});
