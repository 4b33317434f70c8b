/** Deleting a session (final, logged), the retention sweep, and the operator key's storage. */
import { mkdtempSync, readFileSync, rmSync, statSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { ensureOperatorKey, isOperatorKey, OPERATOR_KEY_FILE } from "@contend/db";
import { parseEnv } from "../src/env";
import {
  createSessionOverHttp,
  eventLog,
  expectOk,
  getWithKey,
  hello,
  serverForFile,
} from "./helpers";
import { printShops } from "./fixtures";

const file = serverForFile();

describe("deleting a session", () => {
  it("DELETE with the facilitator key removes events, seats and keys for good and tells connected pages; other keys get an unknown id's answer", async () => {
    const url = file.server.url;
    const created = await createSessionOverHttp(url, printShops());
    const seat = await file.client();
    expectOk(
      await hello(seat, { role: "seat", sessionId: created.id, key: created.seats[0]!.key }),
    );
    const told = new Promise<{ reason: string }>((resolve) => seat.once("revoked", resolve));
    const target = `${url}/api/sessions/${encodeURIComponent(created.id)}`;
    const del = (key: string) =>
      fetch(target, { method: "DELETE", headers: { authorization: `Bearer ${key}` } });
    expect((await fetch(target, { method: "DELETE" })).status).toBe(401);
    for (const key of [created.spectatorKey, created.seats[1]!.key!]) {
      expect((await del(key)).status).toBe(404);
    }
    expect(await eventLog(file.server.db, created.id)).not.toHaveLength(0);
    expect((await del(created.facilitatorKey)).status).toBe(204);
    expect(await told).toMatchObject({ reason: "session-deleted" });
    expect(await eventLog(file.server.db, created.id)).toHaveLength(0);
    expect(await file.server.db.sessions.get(created.id)).toBeNull();
    expect(await file.server.db.keys.resolve(created.id, created.facilitatorKey)).toBeNull();
    const seats = await file.server.db.prisma.seat.count({ where: { sessionId: created.id } });
    expect(seats).toBe(0);
    expect((await del(created.facilitatorKey)).status).toBe(404);
    const fresh = await file.client();
    expect(
      await hello(fresh, {
        role: "facilitator",
        sessionId: created.id,
        key: created.facilitatorKey,
      }),
    ).toMatchObject({ ok: false, code: "unauthorized" });
    expect((await getWithKey(`${target}/export`, created.facilitatorKey)).status).toBe(404);
  });

  it("the retention sweep deletes sessions idle since the cut-off and keeps newer ones", async () => {
    const db = file.server.db;
    const old = await createSessionOverHttp(file.server.url, printShops());
    const cutOff = new Date();
    await db.prisma.session.update({
      where: { id: old.id },
      data: { updatedAt: new Date(cutOff.getTime() - 40 * 86_400_000) },
    });
    const recent = await createSessionOverHttp(file.server.url, printShops());
    const deleted = await db.sessions.deleteIdleSince(new Date(cutOff.getTime() - 30 * 86_400_000));
    expect(deleted).toEqual([old.id]);
    expect(await db.sessions.get(old.id)).toBeNull();
    expect(await db.sessions.get(recent.id)).not.toBeNull();
    expect(parseEnv({ CONTEND_RETAIN_DAYS: "30", WEB: "off" }).retainDays).toBe(30);
    expect(() => parseEnv({ CONTEND_RETAIN_DAYS: "0" })).toThrow(/CONTEND_RETAIN_DAYS/);
  });
});

describe("the operator key", () => {
  it("is made on first start, kept only as its sha256 (mode 0600), and the same on the next start", () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), "contend-operator-"));
    try {
      const first = ensureOperatorKey(dir, null);
      expect(first.created).toMatch(/^[A-Za-z0-9_-]{43}$/);
      const stored = readFileSync(path.join(dir, OPERATOR_KEY_FILE), "utf8");
      expect(stored).not.toContain(first.created!);
      expect(stored.trim()).toMatch(/^[0-9a-f]{64}$/);
      expect(statSync(path.join(dir, OPERATOR_KEY_FILE)).mode & 0o777).toBe(0o600);
      const second = ensureOperatorKey(dir, null);
      expect(second.created).toBeNull();
      expect(isOperatorKey(second.digest, first.created!)).toBe(true);
      expect(isOperatorKey(second.digest, `${first.created!}x`)).toBe(false);
      expect(isOperatorKey(null, first.created!)).toBe(false);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it("a configured key must be at least 24 characters", () => {
    expect(() => parseEnv({ CONTEND_OPERATOR_KEY: "short-key-of-23-chars!!" })).toThrow(
      /CONTEND_OPERATOR_KEY/,
    );
    expect(
      parseEnv({ CONTEND_OPERATOR_KEY: "a-key-of-twenty-four-ch!", WEB: "off" }).operatorKey,
    ).toBe("a-key-of-twenty-four-ch!");
    expect(() => ensureOperatorKey("/nonexistent", "too-short")).toThrow(/24/);
  });
});
