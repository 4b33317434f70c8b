import { describe, expect, it } from "vitest";
import { decodeState, encodeState } from "../src/lib/urlState";

describe("encodeState / decodeState", () => {
  it("encodeState(value) round-trips nested JSON with non-ASCII text", () => {
    const value = {
      sc: {
        title: "Bäckerei Zürich – kiosk",
        prize: 100,
        csf: { kind: "ratio", decisiveness: 1 },
        rivals: [
          { name: "Ä", cost: 5 },
          { name: "B", cost: 2 },
        ],
      },
      sw: { param: "rivals.1.cost", from: 0.5, to: 20, steps: 200 },
    };
    const text = encodeState(value);
    expect(text).toMatch(/^[A-Za-z0-9_-]+$/);
    expect(decodeState(text)).toEqual(value);
  });
  it("encodeState(value) output is URL-safe without escaping", () => {
    const text = encodeState({ s: "???>>>~~~" });
    expect(encodeURIComponent(text)).toBe(text);
  });
  it("decodeState(garbage) returns null instead of throwing", () => {
    expect(decodeState("")).toBeNull();
    expect(decodeState(null)).toBeNull();
    expect(decodeState("%%%")).toBeNull();
    expect(decodeState("bm90IGpzb24")).toBeNull(); // "not json"
    expect(decodeState("_w")).toBeNull(); // invalid UTF-8 byte 0xff
  });
});
