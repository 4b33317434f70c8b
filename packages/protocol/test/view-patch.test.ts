import { describe, expect, it } from "vitest";
import fc from "fast-check";
import jsonpatch from "fast-json-patch";
import type { Operation } from "fast-json-patch";
import { applyPatch, createViewTracker, diffJson, PatchError } from "../src/index";
import type { PatchOp, RoleView } from "../src/index";

/** JSON values as a view holds them: nested objects and arrays, plain keys and odd ones. */
const key = fc.oneof(
  fc.constantFrom("a", "b", "seats", "rounds", "you", "a/b", "m~n", "~1", ""),
  fc.string({ maxLength: 4 }),
);
const json = fc.letrec((tie) => ({
  value: fc.oneof(
    { depthSize: "small" },
    fc.constant(null),
    fc.boolean(),
    fc.integer(),
    fc.double({ noNaN: true, noDefaultInfinity: true }).map((x) => (Object.is(x, -0) ? 0 : x)),
    fc.string({ maxLength: 6 }),
    fc.array(tie("value"), { maxLength: 5 }),
    fc.dictionary(key, tie("value"), { maxKeys: 5 }),
  ),
})).value;

/** Like b, but sharing most of a's structure: the shape of two successive views. */
const related = json.chain((a) => fc.tuple(fc.constant(a), mutate(a)));
function mutate(a: unknown): fc.Arbitrary<unknown> {
  if (Array.isArray(a)) {
    return fc.oneof(
      json,
      fc.constant(a),
      fc.constant(a.slice(0, -1)),
      json.map((x) => [...a, x]),
      a.length === 0
        ? fc.constant(a)
        : fc
            .nat(a.length - 1)
            .chain((i) => mutate(a[i]).map((x) => a.map((y, j) => (j === i ? x : y)))),
    );
  }
  if (a !== null && typeof a === "object") {
    const keys = Object.keys(a);
    return fc.oneof(
      json,
      fc.constant(a),
      fc.tuple(key, json).map(([k, v]) => ({ ...a, [k]: v })),
      keys.length === 0
        ? fc.constant(a)
        : fc.constantFrom(...keys).chain((k) =>
            fc.oneof(
              mutate((a as Record<string, unknown>)[k]).map((v) => ({ ...a, [k]: v })),
              fc.constant(Object.fromEntries(Object.entries(a).filter(([j]) => j !== k))),
            ),
          ),
    );
  }
  return json;
}

const clone = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

describe("diffJson / applyPatch", () => {
  it("applyPatch(a, diffJson(a, b)) equals b, and a is left untouched", () => {
    fc.assert(
      fc.property(related, ([a, b]) => {
        const before = clone(a);
        const out = applyPatch(a, diffJson(a, b));
        expect(out).toEqual(b);
        expect(a).toEqual(before);
      }),
      { numRuns: 2_000 },
    );
  });

  it("an independent RFC 6902 implementation (fast-json-patch) applies our patches to the same result", () => {
    fc.assert(
      fc.property(related, ([a, b]) => {
        const ops = diffJson(a, b) as Operation[];
        const theirs = jsonpatch.applyPatch(clone(a), ops, true, false).newDocument;
        expect(theirs).toEqual(b);
      }),
      { numRuns: 2_000 },
    );
  });

  it("our applyPatch agrees with fast-json-patch on the patches fast-json-patch computes", () => {
    fc.assert(
      fc.property(related, ([a, b]) => {
        // compare() only takes two containers of the same kind
        fc.pre(typeof a === "object" && a !== null && typeof b === "object" && b !== null);
        fc.pre(Array.isArray(a) === Array.isArray(b));
        const ops = jsonpatch.compare(clone(a) as object, clone(b) as object) as PatchOp[];
        expect(applyPatch(a, ops)).toEqual(b);
      }),
      { numRuns: 1_000 },
    );
  });

  it("equal documents give an empty patch; unchanged branches keep their identity", () => {
    const seats = [
      { index: 0, sealed: false },
      { index: 1, sealed: false },
    ];
    const rounds = [{ round: 1, efforts: [3, 4] }];
    const view = { seats, rounds, status: "open" };
    expect(diffJson(view, clone(view))).toEqual([]);
    const next = applyPatch(view, [{ op: "replace", path: "/seats/1/sealed", value: true }]);
    expect(next.rounds).toBe(rounds);
    expect(next.seats[0]).toBe(seats[0]);
    expect(next.seats[1]).toEqual({ index: 1, sealed: true });
    expect(seats[1]!.sealed).toBe(false);
  });

  it("many operations in one patch give what they give one at a time, leaving doc, the ops' values and other branches alone", () => {
    fc.assert(
      fc.property(related, ([a, b]) => {
        const before = clone(a);
        const ops = diffJson(a, b);
        const opsBefore = clone(ops);
        const stepwise = ops.reduce<unknown>((doc, op) => applyPatch(doc, [op]), a);
        const together = applyPatch(a, ops);
        expect(together).toEqual(stepwise);
        expect(a).toEqual(before);
        expect(ops).toEqual(opsBefore);
      }),
      { numRuns: 400 },
    );
    // A value added by one operation and changed by a later one is copied, not mutated.
    const added = { n: 1 };
    const out = applyPatch({ list: [] as unknown[] }, [
      { op: "add", path: "/list/-", value: added },
      { op: "replace", path: "/list/0/n", value: 2 },
      { op: "add", path: "/list/-", value: 3 },
    ]);
    expect(out).toEqual({ list: [{ n: 2 }, 3] });
    expect(added).toEqual({ n: 1 });
    const seats = [{ s: false }, { s: false }, { s: false }];
    const view = { seats, rounds: [1] };
    const next = applyPatch(view, [
      { op: "replace", path: "/seats/0/s", value: true },
      { op: "replace", path: "/seats/2/s", value: true },
    ]);
    expect(next.seats[1]).toBe(seats[1]);
    expect(next.rounds).toBe(view.rounds);
    expect(seats.map((x) => x.s)).toEqual([false, false, false]);
  });

  it("an object key holding undefined counts as absent, as in JSON", () => {
    expect(diffJson({ a: 1, b: undefined }, { a: 1 })).toEqual([]);
    expect(diffJson({ a: 1 }, { a: 1, b: undefined })).toEqual([]);
    expect(diffJson({ a: 1, b: 2 }, { a: 1, b: undefined })).toEqual([
      { op: "remove", path: "/b" },
    ]);
  });

  // Worked examples of RFC 6902 Appendix A and RFC 6901 section 5 (as remembered, not copied).
  it("RFC 6902 A.1-A.5: add member, add array element, remove member, remove element, replace", () => {
    expect(applyPatch({ foo: "bar" }, [{ op: "add", path: "/baz", value: "qux" }])).toEqual({
      baz: "qux",
      foo: "bar",
    });
    expect(
      applyPatch({ foo: ["bar", "baz"] }, [{ op: "add", path: "/foo/1", value: "qux" }]),
    ).toEqual({ foo: ["bar", "qux", "baz"] });
    expect(applyPatch({ baz: "qux", foo: "bar" }, [{ op: "remove", path: "/baz" }])).toEqual({
      foo: "bar",
    });
    expect(applyPatch({ foo: ["bar", "qux", "baz"] }, [{ op: "remove", path: "/foo/1" }])).toEqual({
      foo: ["bar", "baz"],
    });
    expect(
      applyPatch({ baz: "qux", foo: "bar" }, [{ op: "replace", path: "/baz", value: "boo" }]),
    ).toEqual({ baz: "boo", foo: "bar" });
  });

  it("RFC 6901: ~1 is a slash and ~0 a tilde inside a key; '-' appends to an array", () => {
    const doc = { "a/b": 1, "m~n": 8, list: [1] };
    expect(diffJson(doc, { ...doc, "a/b": 2, "m~n": 9 })).toEqual([
      { op: "replace", path: "/a~1b", value: 2 },
      { op: "replace", path: "/m~0n", value: 9 },
    ]);
    expect(applyPatch(doc, [{ op: "add", path: "/list/-", value: 2 }]).list).toEqual([1, 2]);
  });

  it("a key named __proto__ becomes a plain member, never the prototype", () => {
    const out = applyPatch({ a: {} } as Record<string, unknown>, [
      { op: "add", path: "/__proto__", value: { polluted: true } },
      { op: "add", path: "/a/__proto__", value: { polluted: true } },
    ]);
    expect(Object.getPrototypeOf(out)).toBe(Object.prototype);
    expect(Object.getPrototypeOf(out.a)).toBe(Object.prototype);
    expect(Object.keys(out)).toEqual(["a", "__proto__"]);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it("a patch for some other document throws PatchError", () => {
    const bad: PatchOp[][] = [
      [{ op: "replace", path: "/missing", value: 1 }],
      [{ op: "remove", path: "/list/5" }],
      [{ op: "add", path: "/list/7", value: 1 }],
      [{ op: "replace", path: "/list/x", value: 1 }],
      [{ op: "replace", path: "/n/deeper", value: 1 }],
      [{ op: "replace", path: "no-slash", value: 1 }],
      [{ op: "remove", path: "" }],
    ];
    for (const ops of bad) {
      expect(() => applyPatch({ list: [1], n: 3 }, ops), ops[0]!.path).toThrow(PatchError);
    }
  });
});

describe("createViewTracker", () => {
  const v = (round: number) => ({ round, status: "open" }) as unknown as RoleView;

  it("applies a patch on its base, asks for a resync on any other base, ignores old ones", () => {
    const t = createViewTracker();
    expect(t.patch({ seq: 3, base: 2, ops: [] })).toBe("resync");
    t.snapshot(5, v(1));
    expect(t.patch({ seq: 6, base: 5, ops: [{ op: "replace", path: "/round", value: 2 }] })).toBe(
      "applied",
    );
    expect(t.seq).toBe(6);
    expect(t.view?.round).toBe(2);
    expect(t.patch({ seq: 6, base: 5, ops: [] })).toBe("ignored");
    expect(t.patch({ seq: 9, base: 8, ops: [] })).toBe("resync");
    expect(t.patch({ seq: 7, base: 6, ops: [{ op: "remove", path: "/nothing" }] })).toBe("resync");
    expect(t.seq).toBe(6);
  });

  it("a full view never rolls the held one back", () => {
    const t = createViewTracker();
    expect(t.snapshot(4, v(2))).toBe(true);
    expect(t.snapshot(3, v(1))).toBe(false);
    expect(t.view?.round).toBe(2);
    expect(t.snapshot(4, v(3))).toBe(true);
    expect(t.snapshot(2, v(0), true)).toBe(true);
    expect(t.seq).toBe(2);
  });
});
