import { describe, expect, it } from "vitest";
import { sessionFilterSchema } from "@contend/protocol";
import { apiFilter, dayInstant, EMPTY_FILTER } from "../src/lib/libraryApi";

describe("the library filter sent to the server", () => {
  it("a day range covers the whole of both local days", () => {
    const from = new Date(dayInstant("2026-03-02", false)!);
    const to = new Date(dayInstant("2026-03-04", true)!);
    expect([from.getFullYear(), from.getMonth(), from.getDate(), from.getHours()]).toEqual([
      2026, 2, 2, 0,
    ]);
    expect([to.getDate(), to.getHours(), to.getMinutes(), to.getMilliseconds()]).toEqual([
      4, 23, 59, 999,
    ]);
    expect(dayInstant("", false)).toBeUndefined();
    expect(dayInstant("2026-3-2", false)).toBeUndefined();
  });

  it("names the range after the chosen date and passes the protocol's filter schema", () => {
    const f = apiFilter({
      ...EMPTY_FILTER,
      q: " tender ",
      tag: "q3",
      dateOf: "ended",
      from: "2026-01-01",
      to: "2026-01-31",
    });
    expect(Object.keys(f).sort()).toEqual(["archived", "endedFrom", "endedTo", "q", "tag"]);
    expect(f.q).toBe("tender");
    const parsed = sessionFilterSchema.safeParse(f);
    expect(parsed.success).toBe(true);
    expect(apiFilter(EMPTY_FILTER)).toEqual({ archived: "hide" });
  });
});
