import { afterEach, describe, expect, it, vi } from "vitest";
import { deleteSession } from "../src/lib/api";
import { deleteScenario } from "../src/lib/libraryApi";

afterEach(() => vi.unstubAllGlobals());

describe("deleting a session or a saved scenario with its key", () => {
  it("sends DELETE to the entry's path with the key in the Authorization header only", async () => {
    const fetch = vi.fn(async () => new Response(null, { status: 204 }));
    vi.stubGlobal("fetch", fetch);
    expect(await deleteSession("s 1", "k1")).toEqual({ ok: true, data: null });
    expect(await deleteScenario("c/2", "k2")).toEqual({ ok: true, data: null });
    expect(fetch.mock.calls).toEqual([
      ["/api/sessions/s%201", { method: "DELETE", headers: { authorization: "Bearer k1" } }],
      ["/api/scenarios/c%2F2", { method: "DELETE", headers: { authorization: "Bearer k2" } }],
    ]);
  });

  it("returns the server's refusal with its status and error body", async () => {
    const body = { error: { code: "forbidden", path: "key", message: "wrong key" } };
    vi.stubGlobal("fetch", async () => Response.json(body, { status: 403 }));
    expect(await deleteScenario("c", "bad")).toEqual({
      ok: false,
      status: 403,
      code: "forbidden",
      path: "key",
      message: "wrong key",
    });
  });

  it("returns a network failure as a value, not an exception", async () => {
    vi.stubGlobal("fetch", async () => {
      throw new TypeError("Failed to fetch");
    });
    expect(await deleteSession("s", "k")).toEqual({
      ok: false,
      status: 0,
      code: "network",
      path: "",
      message: "cannot reach the server (Failed to fetch)",
    });
  });
});
