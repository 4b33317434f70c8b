/**
 * REST calls of the library: search and edit past sessions, and the saved-scenario library
 * (docs/protocol.md 11.1). Keys travel in the Authorization header only.
 */
import type {
  SavedScenario,
  SavedScenarioCreated,
  SavedVersion,
  SessionListItem,
  SessionPatch,
} from "@contend/protocol";
import { deleteWithKey, listMySessions, listSessions, request } from "./api";
import type { ApiResult } from "./api";
import type { HeldKey } from "./keyring";

/** The library search as the page holds it: every field a string ("" = not set). */
export interface LibraryFilter {
  q: string;
  tag: string;
  /** which date the range applies to */
  dateOf: "created" | "ended";
  /** YYYY-MM-DD in the browser's time zone, inclusive */
  from: string;
  to: string;
  archived: "hide" | "only" | "all";
}

export const EMPTY_FILTER: LibraryFilter = {
  q: "",
  tag: "",
  dateOf: "created",
  from: "",
  to: "",
  archived: "hide",
};

/** A local calendar day's first (or last) millisecond as an ISO instant; "" stays unset. */
export function dayInstant(day: string, end: boolean): string | undefined {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(day);
  if (!m) return undefined;
  const [y, mo, d] = [Number(m[1]), Number(m[2]) - 1, Number(m[3])];
  const date = end ? new Date(y, mo, d, 23, 59, 59, 999) : new Date(y, mo, d, 0, 0, 0, 0);
  return Number.isNaN(date.getTime()) ? undefined : date.toISOString();
}

/** The API's filter object (sessionFilterSchema) from the page's. */
export function apiFilter(f: LibraryFilter): Record<string, string> {
  const out: Record<string, string> = { archived: f.archived };
  if (f.q.trim()) out.q = f.q.trim();
  if (f.tag) out.tag = f.tag;
  const from = dayInstant(f.from, false);
  const to = dayInstant(f.to, true);
  if (from) out[`${f.dateOf}From`] = from;
  if (to) out[`${f.dateOf}To`] = to;
  return out;
}

function bearer(key: string) {
  return { authorization: `Bearer ${key}` };
}

function json(body: unknown): RequestInit {
  return { headers: { "content-type": "application/json" }, body: JSON.stringify(body) };
}

/** GET /api/sessions?…: every session matching, with the operator key. */
export function searchAllSessions(operatorKey: string, f: LibraryFilter) {
  const query = new URLSearchParams(apiFilter(f)).toString();
  return request<SessionListItem[]>(`/api/sessions?${query}`, { headers: bearer(operatorKey) });
}

/** POST /api/sessions/mine with the filter: this browser's sessions matching. */
export function searchMySessions(held: HeldKey[], f: LibraryFilter) {
  return request<SessionListItem[]>("/api/sessions/mine", {
    method: "POST",
    ...json({ sessions: held, filter: apiFilter(f) }),
  });
}

/** A listed session with the key that opens it (its facilitator key, or the operator key). */
export interface KeyedSession {
  item: SessionListItem;
  key: string;
}

/** The operator key, when the page was opened with `#operator=<key>`; "" otherwise. */
export function operatorFromFragment(): string {
  if (typeof window === "undefined") return "";
  return new URLSearchParams(window.location.hash.slice(1)).get("operator") ?? "";
}

/**
 * The sessions a page may list: every session with the operator key, else those whose
 * facilitator keys this browser holds (none held: an empty list, no request). With a filter
 * the server searches; without one it lists.
 */
export async function listKeyedSessions(
  operator: string,
  held: HeldKey[],
  filter?: LibraryFilter,
): Promise<ApiResult<KeyedSession[]>> {
  if (!operator && held.length === 0) return { ok: true, data: [] };
  const r = operator
    ? await (filter ? searchAllSessions(operator, filter) : listSessions(operator))
    : await (filter ? searchMySessions(held, filter) : listMySessions(held));
  if (!r.ok) return r;
  const keys = new Map(held.map((h) => [h.id, h.key]));
  return {
    ok: true,
    data: r.data.map((item) => ({ item, key: operator || (keys.get(item.id) ?? "") })),
  };
}

/** PATCH /api/sessions/<id>: rename, tag, archive. */
export function editSession(id: string, key: string, patch: SessionPatch) {
  const init = json(patch);
  return request<SessionListItem>(`/api/sessions/${encodeURIComponent(id)}`, {
    method: "PATCH",
    ...init,
    headers: { ...(init.headers as Record<string, string>), ...bearer(key) },
  });
}

/** POST /api/scenarios: the first save; the answer's key is shown once. */
export function saveScenario(name: string, note: string, scenario: unknown) {
  return request<SavedScenarioCreated>("/api/scenarios", {
    method: "POST",
    ...json({ name, note, scenario }),
  });
}

/** POST /api/scenarios/<id>/versions. */
export function saveVersion(id: string, key: string, note: string, scenario: unknown) {
  const init = json({ note, scenario });
  return request<{ version: number }>(`/api/scenarios/${encodeURIComponent(id)}/versions`, {
    method: "POST",
    ...init,
    headers: { ...(init.headers as Record<string, string>), ...bearer(key) },
  });
}

/** PATCH /api/scenarios/<id>: a new name (the versions stay); answers the renamed entry. */
export function renameScenario(id: string, key: string, name: string) {
  const init = json({ name });
  return request<SavedScenario>(`/api/scenarios/${encodeURIComponent(id)}`, {
    method: "PATCH",
    ...init,
    headers: { ...(init.headers as Record<string, string>), ...bearer(key) },
  });
}

export function listMyScenarios(held: HeldKey[]) {
  return request<SavedScenario[]>("/api/scenarios/mine", {
    method: "POST",
    ...json({ scenarios: held }),
  });
}

export function listAllScenarios(operatorKey: string) {
  return request<SavedScenario[]>("/api/scenarios", { headers: bearer(operatorKey) });
}

export function getVersion(id: string, key: string, version: number) {
  return request<SavedVersion>(`/api/scenarios/${encodeURIComponent(id)}/versions/${version}`, {
    headers: bearer(key),
  });
}

/** DELETE /api/scenarios/<id>: every version goes. */
export function deleteScenario(id: string, key: string): Promise<ApiResult<null>> {
  return deleteWithKey(`/api/scenarios/${encodeURIComponent(id)}`, key);
}
