/**
 * The saved-scenario library: save, new versions, list, start a session from any version; and
 * its privacy. A saved scenario may hold private numbers, so it opens only with its library
 * key or the operator key; the leak test looks for a distinctive number in every answer given
 * without the key, with a positive control (the same search finds it with the key).
 */
import { describe, expect, it } from "vitest";
import { hashKey } from "@contend/db";
import {
  savedScenarioCreatedSchema,
  savedScenarioListSchema,
  savedScenarioSchema,
  savedVersionSchema,
} from "@contend/protocol";
import { createSessionOverHttp, getWithKey, serverForFile } from "./helpers";
import { printShops } from "./fixtures";

const OPERATOR_KEY = "operator-key-for-the-scenario-library-tests";
const file = serverForFile({ operatorKeyDigest: Buffer.from(hashKey(OPERATOR_KEY), "hex") });

/** A private cost no other fixture uses, matched as a whole JSON number. */
const SECRET = 1.3579;
const SECRET_RE = /(?<![\d.])1\.3579(?!\d)/;

function withCost(cost: number, prize = 100) {
  const s = printShops();
  s.prize = prize;
  s.rivals[2]!.cost = cost;
  return s;
}

function send(method: string, path: string, body?: unknown, key?: string) {
  return fetch(`${file.server.url}${path}`, {
    method,
    headers: {
      ...(body === undefined ? {} : { "content-type": "application/json" }),
      ...(key ? { authorization: `Bearer ${key}` } : {}),
    },
    ...(body === undefined ? {} : { body: JSON.stringify(body) }),
  });
}

async function save(name: string, scenario: unknown, note = "") {
  const res = await send("POST", "/api/scenarios", { name, note, scenario });
  expect(res.status).toBe(201);
  return savedScenarioCreatedSchema.parse(await res.json());
}

async function errorOf(res: Response) {
  return ((await res.json()) as { error: { code: string; path: string; message: string } }).error;
}

describe("saved scenarios with versions", () => {
  it("save, save a second version, list versions, read each, and start a session from version 1", async () => {
    const saved = await save("Poster contract drill", withCost(1.6, 100), "Q3 numbers");
    expect(saved.version).toBe(1);
    const v2 = await send(
      "POST",
      `/api/scenarios/${saved.id}/versions`,
      {
        note: "Q4 numbers",
        scenario: withCost(1.4, 140),
      },
      saved.key,
    );
    expect(v2.status).toBe(201);
    expect(await v2.json()).toEqual({ version: 2 });

    const one = savedScenarioSchema.parse(
      await (await getWithKey(`${file.server.url}/api/scenarios/${saved.id}`, saved.key)).json(),
    );
    expect(one.name).toBe("Poster contract drill");
    expect(one.versions.map((v) => [v.version, v.note])).toEqual([
      [2, "Q4 numbers"],
      [1, "Q3 numbers"],
    ]);
    const first = savedVersionSchema.parse(
      await (
        await getWithKey(`${file.server.url}/api/scenarios/${saved.id}/versions/1`, saved.key)
      ).json(),
    );
    expect(first.scenario).toEqual(withCost(1.6, 100));

    // rerun last quarter's drill: a session from version 1 plays version 1's numbers
    const session = await createSessionOverHttp(file.server.url, first.scenario);
    const exported = (await (
      await getWithKey(
        `${file.server.url}/api/sessions/${session.id}/export`,
        session.facilitatorKey,
      )
    ).json()) as { events: { type: string; scenario?: { prize: number } }[] };
    const created = exported.events.find((e) => e.type === "session-created");
    expect(created?.scenario?.prize).toBe(100);

    const missing = await getWithKey(
      `${file.server.url}/api/scenarios/${saved.id}/versions/3`,
      saved.key,
    );
    expect(missing.status).toBe(404);
    expect(await errorOf(missing)).toMatchObject({ path: "version" });
  });

  it("POST /api/scenarios/mine lists exactly the saved scenarios whose keys are sent; the operator lists all", async () => {
    const a = await save("Mine A", withCost(1.1));
    const b = await save("Mine B", withCost(1.2));
    const res = await send("POST", "/api/scenarios/mine", {
      scenarios: [
        { id: a.id, key: a.key },
        { id: b.id, key: a.key },
      ],
    });
    expect(res.status).toBe(200);
    expect(savedScenarioListSchema.parse(await res.json()).map((s) => s.id)).toEqual([a.id]);
    expect((await send("GET", "/api/scenarios")).status).toBe(401);
    expect((await send("GET", "/api/scenarios", undefined, a.key)).status).toBe(403);
    const all = savedScenarioListSchema.parse(
      await (await getWithKey(`${file.server.url}/api/scenarios`, OPERATOR_KEY)).json(),
    );
    expect(all.map((s) => s.id)).toEqual(expect.arrayContaining([a.id, b.id]));
  });

  it("bad saves answer 400 naming the field, inside the scenario too", async () => {
    const cases: [unknown, string][] = [
      [{ name: "", scenario: withCost(1) }, "name"],
      [{ name: "X", note: "two\nlines", scenario: withCost(1) }, "note"],
      [{ name: "X" }, "scenario"],
      [{ name: "X", scenario: withCost(-2) }, "scenario.rivals.2.cost"],
      [{ name: "X", scenario: printShops({ rounds: 0 }) }, "scenario.session.rounds"],
      [{ name: "X", scenario: withCost(1), extra: 1 }, "extra"],
    ];
    for (const [body, path] of cases) {
      const res = await send("POST", "/api/scenarios", body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      const error = await errorOf(res);
      expect(error.path, JSON.stringify(body)).toBe(path);
      expect(error.message.startsWith(`${path}: `) || path === "", error.message).toBe(true);
    }
  });
});

describe("renaming a saved scenario", () => {
  async function nameOnServer(id: string) {
    return (await file.server.db.scenarios.get(id))?.name;
  }

  it("its key and the operator key rename it; the versions stay; the answer is the entry", async () => {
    const saved = await save("Kiosk lease v1", withCost(1.25), "Q3 numbers");
    const res = await send(
      "PATCH",
      `/api/scenarios/${saved.id}`,
      { name: "  Kiosk lease, base case " },
      saved.key,
    );
    expect(res.status).toBe(200);
    const renamed = savedScenarioSchema.parse(await res.json());
    expect(renamed).toMatchObject({ id: saved.id, name: "Kiosk lease, base case" });
    expect(renamed.versions.map((v) => [v.version, v.note])).toEqual([[1, "Q3 numbers"]]);
    expect(await nameOnServer(saved.id)).toBe("Kiosk lease, base case");
    const got = savedScenarioSchema.parse(
      await (await getWithKey(`${file.server.url}/api/scenarios/${saved.id}`, saved.key)).json(),
    );
    expect(got).toEqual(renamed);

    const byOperator = await send(
      "PATCH",
      `/api/scenarios/${saved.id}`,
      { name: "Kiosk lease, low-cost rival" },
      OPERATOR_KEY,
    );
    expect(byOperator.status).toBe(200);
    expect(savedScenarioSchema.parse(await byOperator.json()).name).toBe(
      "Kiosk lease, low-cost rival",
    );
    expect(await nameOnServer(saved.id)).toBe("Kiosk lease, low-cost rival");
    const version1 = await getWithKey(
      `${file.server.url}/api/scenarios/${saved.id}/versions/1`,
      saved.key,
    );
    expect(savedVersionSchema.parse(await version1.json()).scenario).toEqual(withCost(1.25));
  });

  it("any other key gets the 404 of an unknown id, no key the 401 of an unknown id, and the name stays", async () => {
    const url = file.server.url;
    const target = await save("Kiosk lease v1", withCost(1.5));
    const other = await save("Other", withCost(1.5));
    const session = await createSessionOverHttp(url, printShops());
    const wrongKeys = [other.key, session.facilitatorKey, session.seats[0]!.key!, "not-a-key"];
    const body = { name: "Taken over" };
    const unknown = await send("PATCH", "/api/scenarios/no-such-scenario", body, other.key);
    expect(unknown.status).toBe(404);
    const unknownBody = await unknown.text();
    for (const key of wrongKeys) {
      const res = await send("PATCH", `/api/scenarios/${target.id}`, body, key);
      expect(res.status, key).toBe(404);
      expect(await res.text()).toBe(unknownBody);
    }
    const noKey = await send("PATCH", `/api/scenarios/${target.id}`, body);
    const unknownNoKey = await send("PATCH", "/api/scenarios/no-such-scenario", body);
    expect(noKey.status).toBe(401);
    expect(await noKey.text()).toBe(await unknownNoKey.text());
    // a bad name with a wrong key is still the unknown id's 404 (nothing about the entry leaks)
    const badName = await send("PATCH", `/api/scenarios/${target.id}`, { name: "" }, other.key);
    expect(badName.status).toBe(404);
    expect(await nameOnServer(target.id)).toBe("Kiosk lease v1");

    // positive control: the same request with the right key does rename it
    const right = await send("PATCH", `/api/scenarios/${target.id}`, body, target.key);
    expect(right.status).toBe(200);
    expect(await nameOnServer(target.id)).toBe("Taken over");
  });

  it("a bad name is refused with 400 naming `name`, under the first save's rule", async () => {
    const saved = await save("Kiosk lease v1", withCost(1.5));
    const cases: unknown[] = [
      { name: "" },
      { name: "   " },
      { name: "x".repeat(81) },
      { name: "two\nlines" },
      { name: 7 },
      {},
    ];
    for (const body of cases) {
      const res = await send("PATCH", `/api/scenarios/${saved.id}`, body, saved.key);
      expect(res.status, JSON.stringify(body)).toBe(400);
      const error = await errorOf(res);
      expect(error.path, JSON.stringify(body)).toBe("name");
      expect(error.message, JSON.stringify(body)).toMatch(/^name: /);
      // the first save refuses the same name with the same message
      const first = await send("POST", "/api/scenarios", {
        ...(body as object),
        scenario: withCost(1),
      });
      expect(first.status).toBe(400);
      expect((await errorOf(first)).message).toBe(error.message);
    }
    const extra = await send(
      "PATCH",
      `/api/scenarios/${saved.id}`,
      { name: "Y", note: "n" },
      saved.key,
    );
    expect(extra.status).toBe(400);
    expect((await errorOf(extra)).path).toBe("note");
    expect(await nameOnServer(saved.id)).toBe("Kiosk lease v1");
    // the longest name the rule allows passes
    const longest = "x".repeat(80);
    const ok = await send("PATCH", `/api/scenarios/${saved.id}`, { name: longest }, saved.key);
    expect(ok.status).toBe(200);
    expect(await nameOnServer(saved.id)).toBe(longest);
  });
});

describe("a saved scenario is private to its key", () => {
  it("without its key nothing of it can be read or changed (same answer as an unknown id); with its key or the operator's it can", async () => {
    const url = file.server.url;
    const secret = await save("Private costs", withCost(SECRET));
    const other = await save("Other", withCost(1.5));
    const session = await createSessionOverHttp(url, printShops());
    const paths = [`/api/scenarios/${secret.id}`, `/api/scenarios/${secret.id}/versions/1`];
    const wrongKeys = [other.key, session.facilitatorKey, session.seats[0]!.key!, "not-a-key"];
    const answers: string[] = [];
    for (const path of paths) {
      const unknown = await getWithKey(
        `${url}${path.replace(secret.id, "no-such-scenario")}`,
        other.key,
      );
      const unknownBody = await unknown.text();
      expect(unknown.status).toBe(404);
      for (const key of wrongKeys) {
        const res = await getWithKey(`${url}${path}`, key);
        const text = await res.text();
        answers.push(text);
        expect(res.status).toBe(404);
        expect(text).toBe(unknownBody);
      }
      const noKey = await fetch(`${url}${path}`);
      expect(noKey.status).toBe(401);
      answers.push(await noKey.text());
    }
    const mine = await send("POST", "/api/scenarios/mine", {
      scenarios: [{ id: secret.id, key: other.key }],
    });
    answers.push(await mine.text());
    const list = await getWithKey(`${url}/api/sessions`, session.facilitatorKey);
    answers.push(await list.text());
    for (const key of wrongKeys) {
      const add = await send(
        "POST",
        `/api/scenarios/${secret.id}/versions`,
        { scenario: withCost(2) },
        key,
      );
      expect(add.status).toBe(404);
      answers.push(await add.text());
      const del = await send("DELETE", `/api/scenarios/${secret.id}`, undefined, key);
      expect(del.status).toBe(404);
    }
    for (const text of answers) expect(text).not.toMatch(SECRET_RE);
    expect((await file.server.db.scenarios.get(secret.id))?.versions).toHaveLength(1);

    // positive controls: the same search finds the number with the key and with the operator's
    for (const key of [secret.key, OPERATOR_KEY]) {
      const res = await getWithKey(`${url}/api/scenarios/${secret.id}/versions/1`, key);
      expect(res.status).toBe(200);
      expect(await res.text()).toMatch(SECRET_RE);
    }
    // and its key deletes it, every version with it
    expect(
      (await send("DELETE", `/api/scenarios/${secret.id}`, undefined, secret.key)).status,
    ).toBe(204);
    expect((await getWithKey(`${url}/api/scenarios/${secret.id}`, secret.key)).status).toBe(404);
  });

  it("the library key is stored hashed, never as itself", async () => {
    const saved = await save("Hashed", withCost(1.7));
    const row = await file.server.db.prisma.savedScenario.findUnique({ where: { id: saved.id } });
    expect(row?.keyHash).toBe(hashKey(saved.key));
    expect(JSON.stringify(row)).not.toContain(saved.key);
  });
});
