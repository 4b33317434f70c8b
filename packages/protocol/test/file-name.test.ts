import { describe, expect, it } from "vitest";
import { attachmentHeader, downloadFileName, fileStem } from "../src/fileName";

describe("download file names", () => {
  it("turn a title into hyphenated lower-case ASCII words, accents folded", () => {
    expect(fileStem("Harbour Ferry: Tender 2027!")).toBe("harbour-ferry-tender-2027");
    expect(fileStem("Café Crème — Été")).toBe("cafe-creme-ete");
    expect(fileStem("  ***  ")).toBe("session");
    expect(fileStem("a".repeat(80)).length).toBe(60);
  });

  it("add the UTC date of the session and the extension", () => {
    expect(downloadFileName("Kiosk bids", "csv", "2026-12-04T23:30:00.000Z")).toBe(
      "kiosk-bids-2026-12-04.csv",
    );
    expect(downloadFileName("Kiosk bids", "json")).toBe("kiosk-bids.json");
    expect(downloadFileName("Kiosk bids", "json", "not a date")).toBe("kiosk-bids.json");
  });

  it("make an RFC 6266 attachment header with a quoted ASCII name and a UTF-8 name", () => {
    expect(attachmentHeader("kiosk-bids-2026-12-04.csv")).toBe(
      `attachment; filename="kiosk-bids-2026-12-04.csv"; filename*=UTF-8''kiosk-bids-2026-12-04.csv`,
    );
    expect(attachmentHeader('a"b.json')).toContain('filename="a_b.json"');
  });
});
