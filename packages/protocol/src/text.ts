/**
 * The one text rule for everything a client sends (REST bodies, socket messages, scenario
 * files, ids in URLs). PostgreSQL refuses NUL in text and lone surrogates cannot be encoded as
 * UTF-8, so such text would fail deep inside a commit; control characters in a name would
 * mislead whoever reads it; and `__proto__`, `constructor` or `prototype` as object keys (or as
 * rival names, which become keys of `session.computer`) reach the prototype chain of plain
 * objects. All of it is refused at the boundary with `bad-request` naming the field.
 */

/** Object keys and names that are never accepted. */
export const RESERVED_KEYS: ReadonlySet<string> = new Set([
  "__proto__",
  "constructor",
  "prototype",
]);

/**
 * Characters refused in any string: NUL and the other C0 controls except tab, line feed and
 * carriage return; DEL; the C1 controls. Lone surrogates are checked separately.
 */
// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f]/;
/** In a name, id, key or code (one line): every control character, tab and newlines included. */
// eslint-disable-next-line no-control-regex
const CONTROL_IN_NAME = /[\u0000-\u001f\u007f-\u009f]/;

function hasLoneSurrogate(s: string): boolean {
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c >= 0xd800 && c <= 0xdbff) {
      const next = s.charCodeAt(i + 1);
      if (next >= 0xdc00 && next <= 0xdfff) i++;
      else return true;
    } else if (c >= 0xdc00 && c <= 0xdfff) return true;
  }
  return false;
}

function describeChar(s: string, re: RegExp): string {
  const m = re.exec(s);
  const code = m ? m[0].charCodeAt(0) : 0;
  return code === 0
    ? "the NUL character"
    : `control character U+${code.toString(16).toUpperCase().padStart(4, "0")}`;
}

/** What is wrong with a free text (a title, a note), or null. */
export function textProblem(s: string): string | null {
  if (hasLoneSurrogate(s)) return "must not contain a lone surrogate (invalid Unicode)";
  if (CONTROL.test(s)) return `must not contain ${describeChar(s, CONTROL)}`;
  return null;
}

/** What is wrong with a one-line free text (a seat's reason), or null. */
export function lineProblem(s: string): string | null {
  if (hasLoneSurrogate(s)) return "must not contain a lone surrogate (invalid Unicode)";
  if (CONTROL_IN_NAME.test(s)) return `must not contain ${describeChar(s, CONTROL_IN_NAME)}`;
  return null;
}

/** What is wrong with a name, id, key or code (one line, never an object key), or null. */
export function nameProblem(s: string): string | null {
  const line = lineProblem(s);
  if (line) return line;
  if (RESERVED_KEYS.has(s.trim())) return `${JSON.stringify(s.trim())} is a reserved word`;
  return null;
}

export interface TextIssue {
  path: (string | number)[];
  message: string;
}

/** Deeper than any message this protocol accepts; deeper input is refused, not walked. */
const MAX_DEPTH = 32;

/**
 * The first string or object key in `value` (parsed JSON) that breaks the rule, with its path.
 * Keys get the name rule; strings under a key called `name`, `displayName` or `title` too.
 */
export function findTextIssue(value: unknown): TextIssue | null {
  const path: (string | number)[] = [];
  function walk(v: unknown, depth: number, asName: boolean): string | null {
    if (typeof v === "string") return asName ? nameProblem(v) : textProblem(v);
    if (typeof v !== "object" || v === null) return null;
    if (depth > MAX_DEPTH) return `nested deeper than ${MAX_DEPTH} levels`;
    if (Array.isArray(v)) {
      for (let i = 0; i < v.length; i++) {
        path.push(i);
        const p = walk(v[i], depth + 1, false);
        if (p) return p;
        path.pop();
      }
      return null;
    }
    for (const key of Object.keys(v)) {
      path.push(key);
      const keyIssue = nameProblem(key);
      if (keyIssue) return `field name ${keyIssue}`;
      const p = walk((v as Record<string, unknown>)[key], depth + 1, NAME_FIELDS.has(key));
      if (p) return p;
      path.pop();
    }
    return null;
  }
  const message = walk(value, 0, false);
  return message === null ? null : { path: [...path], message };
}

/** Fields whose strings are names: shown as labels and used to look rivals up. */
const NAME_FIELDS: ReadonlySet<string> = new Set([
  "name",
  "displayName",
  "title",
  "clientMoveId",
  "joinCode",
  "sessionId",
  "key",
  "leader",
]);
