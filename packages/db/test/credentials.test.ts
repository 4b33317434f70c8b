import { describe, expect, it } from "vitest";
import { hashKey, JOIN_CODE_ALPHABET, newJoinCode, newKey, normaliseJoinCode } from "../src/index";

describe("credentials", () => {
  it('hashKey("abc") is the SHA-256 test vector of FIPS 180-2, appendix B.1', () => {
    expect(hashKey("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("newKey() is 32 random bytes in base64url: 43 characters, no padding, all distinct", () => {
    const keys = Array.from({ length: 200 }, newKey);
    for (const key of keys) {
      expect(key).toMatch(/^[A-Za-z0-9_-]{43}$/);
      expect(Buffer.from(key, "base64url")).toHaveLength(32);
    }
    expect(new Set(keys).size).toBe(keys.length);
  });

  it("newJoinCode() is 6 characters from an alphabet without 0, O, 1, I or L", () => {
    expect(JOIN_CODE_ALPHABET).not.toMatch(/[0O1IL]/);
    expect(new Set(JOIN_CODE_ALPHABET).size).toBe(JOIN_CODE_ALPHABET.length);
    const seen = new Set<string>();
    for (let i = 0; i < 2000; i++) {
      const code = newJoinCode();
      expect(code).toHaveLength(6);
      for (const ch of code) {
        expect(JOIN_CODE_ALPHABET).toContain(ch);
        seen.add(ch);
      }
    }
    // 12 000 draws from 31 symbols: each is missed with probability (30/31)^12000 ~ 1e-171.
    expect(seen.size).toBe(JOIN_CODE_ALPHABET.length);
  });

  it("normaliseJoinCode ignores case, spaces and dashes", () => {
    expect(normaliseJoinCode(" abc-d2 3 ")).toBe("ABCD23");
  });
});
