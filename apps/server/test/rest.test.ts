import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { healthSchema, sessionListSchema } from "@contend/protocol";
import { createApplication } from "../src/app";
import { createSessionOverHttp, removeDataDir, startServer } from "./helpers";
import type { TestServer } from "./helpers";
import { printShops } from "./fixtures";

let server: TestServer;
beforeAll(async () => {
  server = await startServer({ publicUrl: "https://workshop.example.org" });
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
      `https://workshop.example.org/facilitate/${body.id}?key=${body.facilitatorKey}`,
    );
    expect(body.links.spectator).toContain(`/screen/${body.id}?key=`);
    expect(body.links.join).toBe(`https://workshop.example.org/join?code=${body.joinCode}`);
    expect(body.seats.map((s) => [s.kind, s.key === null, s.link === null])).toEqual([
      ["human", false, false],
      ["human", false, false],
      ["computer", true, true],
    ]);
    const list = sessionListSchema.parse(await (await fetch(`${server.url}/api/sessions`)).json());
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
    const r3 = await fetch(`${server.url}/api/sessions/nope/export`);
    expect(r3.status).toBe(404);
    const r4 = await fetch(`${server.url}/api/sessions/%E0%A4%A/export`);
    expect(r4.status).toBe(404);
  });

  it("without the web app built, pages get a placeholder that says so", async () => {
    const res = await fetch(`${server.url}/facilitate/abc?key=x`);
    expect(res.status).toBe(200);
    expect(await res.text()).toContain("web app has not been built");
  });

  it("with CONTEND_ADMIN_KEY set, listing needs it and exporting needs it or the facilitator key", async () => {
    const created = await createSessionOverHttp(server.url, printShops());
    const app = createApplication({ db: server.db, adminKey: "admin-secret-123" });
    const { port } = await app.listen(0, "127.0.0.1");
    const base = `http://127.0.0.1:${port}`;
    try {
      expect((await fetch(`${base}/api/sessions`)).status).toBe(401);
      const listed = await fetch(`${base}/api/sessions`, {
        headers: { authorization: "Bearer admin-secret-123" },
      });
      expect(listed.status).toBe(200);
      const exportUrl = `${base}/api/sessions/${created.id}/export`;
      expect((await fetch(exportUrl)).status).toBe(401);
      expect((await fetch(`${exportUrl}?key=${created.spectatorKey}`)).status).toBe(401);
      expect((await fetch(`${exportUrl}?key=${created.facilitatorKey}`)).status).toBe(200);
      expect((await fetch(`${exportUrl}?key=admin-secret-123&format=csv`)).status).toBe(200);
      const wrongFormat = await fetch(`${exportUrl}?key=admin-secret-123&format=xml`);
      expect(wrongFormat.status).toBe(400);
      expect((await errorOf(wrongFormat)).path).toBe("format");
    } finally {
      await app.close();
    }
  });

  it("exports download as files named after the session's title and creation date", async () => {
    const created = await createSessionOverHttp(server.url, printShops());
    const list = sessionListSchema.parse(await (await fetch(`${server.url}/api/sessions`)).json());
    const day = list.find((s) => s.id === created.id)!.createdAt.slice(0, 10);
    const stem = `three-print-shops-bid-for-the-library-poster-contract-${day}`;
    for (const [query, ext] of [
      ["", "json"],
      ["?format=csv", "csv"],
    ] as const) {
      const res = await fetch(`${server.url}/api/sessions/${created.id}/export${query}`);
      expect(res.status).toBe(200);
      expect(res.headers.get("content-disposition")).toBe(
        `attachment; filename="${stem}.${ext}"; filename*=UTF-8''${stem}.${ext}`,
      );
    }
  });
});
