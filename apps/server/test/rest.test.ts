import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { healthSchema, sessionListSchema } from "@contend/protocol";
import { hashKey } from "@contend/db";
import { createSessionOverHttp, getWithKey, removeDataDir, startServer } from "./helpers";
import type { TestServer } from "./helpers";
import { printShops } from "./fixtures";

const OPERATOR_KEY = "operator-key-for-the-rest-tests";
let server: TestServer;
beforeAll(async () => {
  server = await startServer({
    publicUrl: "https://workshop.example.org",
    operatorKeyDigest: Buffer.from(hashKey(OPERATOR_KEY), "hex"),
  });
});
afterAll(async () => {
  await server.stop();
  removeDataDir(server.dataDir);
});

function post(body: string, headers: Record<string, string> = {}) {
  return fetch(`${server.url}/api/sessions`, {
    method: "POST",
    headers: { "content-type": "application/json", ...headers },
    body,
  });
}

async function errorOf(res: Response) {
  const body = (await res.json()) as { error: { code: string; path: string; message: string } };
  return body.error;
}

describe("REST", () => {
  it("GET /api/health answers {ok, version, db}", async () => {
    const res = await fetch(`${server.url}/api/health`);
    expect(res.status).toBe(200);
    const body = healthSchema.parse(await res.json());
    expect(body.db).toBe("pglite");
  });

  it("POST /api/sessions creates a session with keys and links under PUBLIC_URL", async () => {
    const res = await post(
      JSON.stringify(printShops({ computer: { "Cobble Copy": { kind: "best-reply" } } })),
    );
    expect(res.status).toBe(201);
    const body = (await res.json()) as Awaited<ReturnType<typeof createSessionOverHttp>>;
    expect(body.joinCode).toMatch(/^[2-9A-HJKMNP-Z]{6}$/);
    expect(body.links.facilitator).toBe(
      `https://workshop.example.org/facilitate/${body.id}#key=${body.facilitatorKey}`,
    );
    expect(body.links.spectator).toContain(`/screen/${body.id}#key=`);
    expect(body.links.join).toBe(`https://workshop.example.org/join?code=${body.joinCode}`);
    expect(body.seats.map((s) => [s.kind, s.key === null, s.link === null])).toEqual([
      ["human", false, false],
      ["human", false, false],
      ["computer", true, true],
    ]);
    const list = sessionListSchema.parse(
      await (await getWithKey(`${server.url}/api/sessions`, OPERATOR_KEY)).json(),
    );
    expect(list.find((s) => s.id === body.id)).toMatchObject({ status: "lobby", rounds: 0 });
  });

  it("POST /api/sessions answers 400 naming the offending field", async () => {
    const bad = printShops();
    bad.rivals[1]!.cost = -2;
    const e1 = await post(JSON.stringify(bad));
    expect(e1.status).toBe(400);
    expect(await errorOf(e1)).toMatchObject({ code: "bad-request", path: "rivals.1.cost" });

    const e2 = await post(JSON.stringify(printShops({ rounds: 0 })));
    expect(e2.status).toBe(400);
    expect((await errorOf(e2)).path).toBe("session.rounds");

    const e3 = await post(
      JSON.stringify(printShops({ computer: { Nobody: { kind: "equilibrium" } } })),
    );
    expect((await errorOf(e3)).path).toBe("session.computer.Nobody");

    const e4 = await post("{not json");
    expect(e4.status).toBe(400);
    expect((await errorOf(e4)).code).toBe("bad-request");

    const e5 = await post("[]");
    expect(e5.status).toBe(400);

    const e6 = await post(JSON.stringify(printShops()), { "content-type": "text/plain" });
    expect(e6.status).toBe(415);
  });

  it("POST /api/sessions answers 413 for a body over the limit", async () => {
    const huge = JSON.stringify({ ...printShops(), title: "x".repeat(300 * 1024) });
    const res = await post(huge);
    expect(res.status).toBe(413);
    expect((await errorOf(res)).code).toBe("too-large");
  });

  it("unknown API routes answer 404 and wrong methods 405, both as JSON errors", async () => {
    const r1 = await fetch(`${server.url}/api/nothing`);
    expect(r1.status).toBe(404);
    expect((await errorOf(r1)).code).toBe("not-found");
    const r2 = await fetch(`${server.url}/api/health`, { method: "DELETE" });
    expect(r2.status).toBe(405);
    const r3 = await getWithKey(`${server.url}/api/sessions/nope/export`, OPERATOR_KEY);
    expect(r3.status).toBe(404);
    const r4 = await getWithKey(`${server.url}/api/sessions/%E0%A4%A/export`, OPERATOR_KEY);
    expect(r4.status).toBe(404);
  });

  it("without the web app built, pages get a placeholder that says so", async () => {
    const res = await fetch(`${server.url}/facilitate/abc?key=x`);
    expect(res.status).toBe(200);
    expect(await res.text()).toContain("web app has not been built");
  });

  it("listing needs the operator key; exporting needs it or the facilitator key, in the Authorization header", async () => {
    const created = await createSessionOverHttp(server.url, printShops());
    const base = server.url;
    expect((await fetch(`${base}/api/sessions`)).status).toBe(401);
    expect((await getWithKey(`${base}/api/sessions`, created.facilitatorKey)).status).toBe(403);
    expect((await getWithKey(`${base}/api/sessions`, OPERATOR_KEY)).status).toBe(200);
    const exportUrl = `${base}/api/sessions/${created.id}/export`;
    expect((await fetch(exportUrl)).status).toBe(401);
    // a key in the query string is not read
    expect((await fetch(`${exportUrl}?key=${created.facilitatorKey}`)).status).toBe(401);
    expect((await getWithKey(exportUrl, created.facilitatorKey)).status).toBe(200);
    expect((await getWithKey(`${exportUrl}?format=csv`, OPERATOR_KEY)).status).toBe(200);
    const wrongFormat = await getWithKey(`${exportUrl}?format=xml`, OPERATOR_KEY);
    expect(wrongFormat.status).toBe(400);
    expect((await errorOf(wrongFormat)).path).toBe("format");
  });

  it("exports download as files named after the session's title and creation date", async () => {
    const created = await createSessionOverHttp(server.url, printShops());
    const list = sessionListSchema.parse(
      await (await getWithKey(`${server.url}/api/sessions`, OPERATOR_KEY)).json(),
    );
    const day = list.find((s) => s.id === created.id)!.createdAt.slice(0, 10);
    const stem = `three-print-shops-bid-for-the-library-poster-contract-${day}`;
    for (const [query, ext] of [
      ["", "json"],
      ["?format=csv", "csv"],
    ] as const) {
      const res = await getWithKey(
        `${server.url}/api/sessions/${created.id}/export${query}`,
        created.facilitatorKey,
      );
      expect(res.status).toBe(200);
      expect(res.headers.get("content-disposition")).toBe(
        `attachment; filename="${stem}.${ext}"; filename*=UTF-8''${stem}.${ext}`,
      );
    }
  });
});
