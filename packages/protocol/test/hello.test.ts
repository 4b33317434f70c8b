import { describe, expect, it } from "vitest";
import { parseHello, PROTOCOL_VERSION } from "../src/index";

const key = "q".repeat(43);

describe("parseHello", () => {
  it("PROTOCOL_VERSION is 2 (pushed views became patches)", () => {
    expect(PROTOCOL_VERSION).toBe(2);
  });

  it("parseHello(each role's credentials) is accepted", () => {
    const creds = [
      { role: "facilitator", sessionId: "s1", key },
      { role: "seat", sessionId: "s1", key },
      { role: "seat", sessionId: "s1", key, displayName: "Ana" },
      { role: "spectator", sessionId: "s1", key },
      { role: "guest", joinCode: "KIOSK7" },
    ];
    for (const credentials of creds) {
      expect(parseHello({ protocol: 2, credentials }).ok, credentials.role).toBe(true);
    }
    expect(parseHello({ protocol: 2, credentials: creds[0], lastSeq: 12 }).ok).toBe(true);
  });

  it("parseHello(protocol 1, the previous version) is version-mismatch", () => {
    const r = parseHello({ protocol: 1, credentials: { role: "guest", joinCode: "KIOSK7" } });
    expect(r).toMatchObject({ ok: false, code: "version-mismatch", path: "protocol" });
  });

  it("parseHello(missing or non-numeric protocol) is bad-request", () => {
    const credentials = { role: "guest", joinCode: "KIOSK7" };
    expect(parseHello({ credentials })).toMatchObject({
      ok: false,
      code: "bad-request",
      path: "protocol",
    });
    expect(parseHello({ protocol: "1", credentials })).toMatchObject({
      ok: false,
      code: "bad-request",
    });
  });

  it("parseHello(bad credentials) names the field", () => {
    const cases: [unknown, string][] = [
      [{ role: "admin", sessionId: "s", key }, "credentials.role"],
      [{ role: "seat", sessionId: "s" }, "credentials.key"],
      [{ role: "seat", sessionId: "", key }, "credentials.sessionId"],
      [{ role: "seat", sessionId: "s", key: "k".repeat(129) }, "credentials.key"],
      [{ role: "guest", joinCode: "ab" }, "credentials.joinCode"],
      [{ role: "guest", joinCode: "KIOSK7", sessionId: "s" }, "credentials.sessionId"],
    ];
    for (const [credentials, path] of cases) {
      expect(parseHello({ protocol: 2, credentials }), path).toMatchObject({
        ok: false,
        code: "bad-request",
        path,
      });
    }
  });

  it("parseHello(negative lastSeq) is refused", () => {
    const r = parseHello({
      protocol: 2,
      credentials: { role: "guest", joinCode: "KIOSK7" },
      lastSeq: -1,
    });
    expect(r).toMatchObject({ ok: false, path: "lastSeq" });
  });
});
