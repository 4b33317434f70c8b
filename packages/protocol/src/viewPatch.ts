/**
 * Pushed views as differences. After the hello ack (a full view), every commit reaches a
 * connection as the JSON Patch (RFC 6902: add, remove, replace; paths are RFC 6901 JSON
 * Pointers) that turns the view it holds into the new one. A round with eight seats sends a
 * few hundred bytes per seal instead of the whole view to every connection.
 */
import type { RoleView } from "./view";

export type PatchOp =
  | { op: "add"; path: string; value: unknown }
  | { op: "replace"; path: string; value: unknown }
  | { op: "remove"; path: string };

/**
 * A pushed patch: `base` is the seq of the view it applies to (the one this connection was last
 * given), `seq` that of the view it produces.
 */
export type ViewPatchMessage = { seq: number; base: number; ops: PatchOp[] };

type Json = unknown;
type JsonObject = Record<string, Json>;

function isObject(v: Json): v is JsonObject {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

function escapeToken(key: string): string {
  if (!key.includes("~") && !key.includes("/")) return key;
  return key.replace(/~/g, "~0").replace(/\//g, "~1");
}

function unescapeToken(token: string): string {
  if (!token.includes("~")) return token;
  return token.replace(/~1/g, "/").replace(/~0/g, "~");
}

/**
 * The operations that turn `before` into `after` (both JSON values; an object key holding
 * `undefined` counts as absent, as JSON.stringify drops it). Arrays are compared index by
 * index, growing or shrinking at the end, which is how views change (rounds and seats are
 * appended, never reordered).
 */
export function diffJson(before: Json, after: Json): PatchOp[] {
  const ops: PatchOp[] = [];
  diffInto(before, after, [], ops);
  return ops;
}

// The path is kept as raw tokens and only written out for an operation: most of a view is
// unchanged, and building pointer strings for every member visited was most of the cost.
function pointer(tokens: readonly (string | number)[], last: string | number): string {
  let out = "";
  for (const t of tokens) out += "/" + escapeToken(String(t));
  return out + "/" + escapeToken(String(last));
}

function diffInto(a: Json, b: Json, tokens: (string | number)[], ops: PatchOp[]): void {
  if (a === b) return;
  if (Array.isArray(a) && Array.isArray(b)) {
    const common = Math.min(a.length, b.length);
    for (let i = 0; i < common; i++) descend(a[i], b[i], tokens, i, ops);
    for (let i = common; i < b.length; i++) {
      ops.push({ op: "add", path: pointer(tokens, i), value: b[i] });
    }
    for (let i = a.length - 1; i >= common; i--)
      ops.push({ op: "remove", path: pointer(tokens, i) });
    return;
  }
  if (isObject(a) && isObject(b)) {
    for (const key in a) {
      if (a[key] !== undefined && b[key] === undefined) {
        ops.push({ op: "remove", path: pointer(tokens, key) });
      }
    }
    for (const key in b) {
      const value = b[key];
      if (value === undefined) continue;
      if (a[key] === undefined) ops.push({ op: "add", path: pointer(tokens, key), value });
      else descend(a[key], value, tokens, key, ops);
    }
    return;
  }
  ops.push({
    op: "replace",
    path: tokens.length === 0 ? "" : pointer(tokens.slice(0, -1), tokens[tokens.length - 1]!),
    value: b,
  });
}

function descend(
  a: Json,
  b: Json,
  tokens: (string | number)[],
  token: string | number,
  ops: PatchOp[],
) {
  if (a === b) return;
  tokens.push(token);
  diffInto(a, b, tokens, ops);
  tokens.pop();
}

export class PatchError extends Error {}

/**
 * Applies operations without touching `doc`: containers along each changed path are copied,
 * everything else is shared, so a screen can tell by identity what changed. Throws
 * PatchError when a path does not exist in the document (a patch for some other base).
 */
export function applyPatch<T>(doc: T, ops: readonly PatchOp[]): T {
  let root: Json = doc;
  // Containers this call has copied already: later operations change them in place, so a
  // patch of many operations under one array copies that array once, not once per operation.
  const copies = new Set<object>();
  for (const op of ops) root = applyOne(root, op, copies);
  return root as T;
}

function applyOne(root: Json, op: PatchOp, copies: Set<object>): Json {
  if (op.path === "") {
    if (op.op === "remove") throw new PatchError("cannot remove the whole document");
    return op.value;
  }
  if (!op.path.startsWith("/")) throw new PatchError(`bad JSON Pointer ${op.path}`);
  const tokens = op.path.slice(1).split("/").map(unescapeToken);
  return update(root, tokens, 0, op, copies);
}

function arrayIndex(token: string, length: number, allowEnd: boolean): number {
  if (token === "-" && allowEnd) return length;
  if (!/^(0|[1-9][0-9]*)$/.test(token)) throw new PatchError(`bad array index ${token}`);
  const i = Number(token);
  if (i > length || (i === length && !allowEnd)) throw new PatchError(`index ${i} out of range`);
  return i;
}

/** A plain own property even for a key like "__proto__", which `o[k] = v` would not make. */
function setMember(o: JsonObject, key: string, value: Json) {
  // Assignment is much faster, and makes an own data property for every key but this one
  // (Object.prototype has no other setter).
  if (key !== "__proto__") o[key] = value;
  else
    Object.defineProperty(o, key, { value, enumerable: true, writable: true, configurable: true });
}

function update(
  node: Json,
  tokens: string[],
  depth: number,
  op: PatchOp,
  copies: Set<object>,
): Json {
  const token = tokens[depth]!;
  const last = depth === tokens.length - 1;
  if (Array.isArray(node)) {
    const i = arrayIndex(token, node.length, last && op.op === "add");
    const copy = copies.has(node) ? node : owned(node.slice(), copies);
    if (!last) copy[i] = update(node[i], tokens, depth + 1, op, copies);
    else if (op.op === "add") copy.splice(i, 0, op.value);
    else if (op.op === "remove") copy.splice(i, 1);
    else copy[i] = op.value;
    return copy;
  }
  if (isObject(node)) {
    const has = Object.prototype.hasOwnProperty.call(node, token);
    if (!last && !has) throw new PatchError(`no member ${token}`);
    if (last && op.op !== "add" && !has) throw new PatchError(`no member ${token} to ${op.op}`);
    const copy: JsonObject = copies.has(node) ? node : owned({ ...node }, copies);
    if (!last) setMember(copy, token, update(node[token], tokens, depth + 1, op, copies));
    else if (op.op === "remove") delete copy[token];
    else setMember(copy, token, op.value);
    return copy;
  }
  throw new PatchError(`cannot descend into a ${node === null ? "null" : typeof node}`);
}

function owned<T extends object>(copy: T, copies: Set<object>): T {
  copies.add(copy);
  return copy;
}

/**
 * What a client holds: the last full view and its seq, moved on by patches. `patch` answers
 * "resync" when the patch is for another base (or does not fit): the client then says hello
 * again and gets a full view. Anything older than what is held is ignored.
 */
export interface ViewTracker {
  readonly seq: number;
  readonly view: RoleView | null;
  /** a full view (`view` message); `replace`: even if older (a hello ack is authoritative) */
  snapshot(seq: number, view: RoleView, replace?: boolean): boolean;
  patch(msg: ViewPatchMessage): "applied" | "ignored" | "resync";
}

export function createViewTracker(): ViewTracker {
  let seq = 0;
  let view: RoleView | null = null;
  return {
    get seq() {
      return seq;
    },
    get view() {
      return view;
    },
    snapshot(nextSeq, nextView, replace = false) {
      if (!replace && view !== null && nextSeq < seq) return false;
      seq = nextSeq;
      view = nextView;
      return true;
    },
    patch(msg) {
      if (view !== null && msg.seq <= seq) return "ignored";
      if (view === null || msg.base !== seq) return "resync";
      try {
        view = applyPatch(view, msg.ops);
      } catch (error) {
        if (error instanceof PatchError) return "resync";
        throw error;
      }
      seq = msg.seq;
      return "applied";
    },
  };
}
