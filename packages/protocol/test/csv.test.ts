/** toCsv against RFC 4180 (Shafranovich 2005): quoting, doubled quotes, CRLF line ends. */
import { describe, expect, it } from "vitest";
import { toCsv } from "../src/csv";

describe("toCsv(header, rows)", () => {
  it("toCsv quotes commas and quotes, defuses formulas and ends lines with CRLF (RFC 4180)", () => {
    const text = toCsv(
      ["a", "b", "c"],
      [
        ["x,y", 'say "hi"', 1.5],
        ["=SUM(A1)", null, true],
      ],
    );
    expect(text).toBe('a,b,c\r\n"x,y","say ""hi""",1.5\r\n\'=SUM(A1),,true\r\n');
  });
});
