/** REST calls to the Contend server (same origin unless NEXT_PUBLIC_SERVER_URL says otherwise). */
import type { CreateSessionResponse, SessionListItem } from "@contend/protocol";
import type { FrontsSessionInput, SessionScenarioInput } from "./sessionTypes";

export type ApiResult<T> =
  | { ok: true; data: T }
  | { ok: false; status: number; code: string; path: string; message: string };

/** Always same-origin: under `next dev` with NEXT_PUBLIC_SERVER_URL, next.config rewrites /api/*. */
export function apiUrl(path: string): string {
  return path;
}

export async function readError(
  res: Response,
): Promise<{ code: string; path: string; message: string }> {
  try {
    const body = (await res.json()) as {
      error?: { code?: string; path?: string; message?: string };
    };
    if (body.error) {
      return {
        code: body.error.code ?? "internal",
        path: body.error.path ?? "",
        message: body.error.message ?? res.statusText,
      };
    }
  } catch {
    // not JSON: fall through
  }
  return {
    code: res.status === 404 ? "not-found" : "internal",
    path: "",
    message: `${res.status} ${res.statusText}`,
  };
}

/** A request that never reached the server (offline, refused, blocked), as a result. */
function unreachable(e: unknown): ApiResult<never> {
  return {
    ok: false,
    status: 0,
    code: "network",
    path: "",
    message: `cannot reach the server (${(e as Error).message})`,
  };
}

/** DELETE `path` with the key in the Authorization header; the body, if any, is not read. */
export async function deleteWithKey(path: string, key: string): Promise<ApiResult<null>> {
  try {
    const res = await fetch(apiUrl(path), {
      method: "DELETE",
      headers: { authorization: `Bearer ${key}` },
    });
    if (!res.ok) return { ok: false, status: res.status, ...(await readError(res)) };
    return { ok: true, data: null };
  } catch (e) {
    return unreachable(e);
  }
}

export async function request<T>(path: string, init?: RequestInit): Promise<ApiResult<T>> {
  let res: Response;
  try {
    res = await fetch(apiUrl(path), {
      ...init,
      headers: { accept: "application/json", ...(init?.headers ?? {}) },
    });
  } catch (e) {
    return unreachable(e);
  }
  if (!res.ok) return { ok: false, status: res.status, ...(await readError(res)) };
  return { ok: true, data: (await res.json()) as T };
}

export function createSession(
  scenario: SessionScenarioInput | FrontsSessionInput,
): Promise<ApiResult<CreateSessionResponse>> {
  return request<CreateSessionResponse>("/api/sessions", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(scenario),
  });
}

/** Keys go in the Authorization header, never in a URL (no log, history or Referer keeps them). */
function withKey(key: string | undefined): RequestInit {
  return key ? { headers: { authorization: `Bearer ${key}` } } : {};
}

/** GET /api/sessions: every session; needs the operator key. */
export function listSessions(operatorKey: string): Promise<ApiResult<SessionListItem[]>> {
  return request<SessionListItem[]>("/api/sessions", withKey(operatorKey));
}

/** POST /api/sessions/mine: the sessions among these whose facilitator keys are right. */
export function listMySessions(
  sessions: { id: string; key: string }[],
): Promise<ApiResult<SessionListItem[]>> {
  return request<SessionListItem[]>("/api/sessions/mine", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ sessions }),
  });
}

/** Raw export body; the caller validates it with the protocol schema. */
export function exportSession(id: string, key?: string): Promise<ApiResult<unknown>> {
  return request<unknown>(`/api/sessions/${encodeURIComponent(id)}/export`, withKey(key));
}

/** GET /api/sessions/:id/summary (facilitator or operator key); the caller validates the body. */
export function sessionSummary(id: string, key: string): Promise<ApiResult<unknown>> {
  return request<unknown>(`/api/sessions/${encodeURIComponent(id)}/summary`, withKey(key));
}

/** The export as a file to save (JSON or CSV), fetched with the key in its header. */
export async function exportFile(
  id: string,
  key: string,
  format: "json" | "csv",
): Promise<ApiResult<{ blob: Blob; fileName: string }>> {
  const path = `/api/sessions/${encodeURIComponent(id)}/export${format === "csv" ? "?format=csv" : ""}`;
  try {
    const res = await fetch(apiUrl(path), withKey(key));
    if (!res.ok) return { ok: false, status: res.status, ...(await readError(res)) };
    // The server names the file (title and date) in Content-Disposition.
    const disposition = res.headers.get("content-disposition") ?? "";
    const named = /filename="([^"]+)"/.exec(disposition)?.[1];
    return {
      ok: true,
      data: { blob: await res.blob(), fileName: named ?? `session-${id}.${format}` },
    };
  } catch (e) {
    return unreachable(e);
  }
}

/** DELETE /api/sessions/<id>: final. */
export function deleteSession(id: string, key: string): Promise<ApiResult<null>> {
  return deleteWithKey(`/api/sessions/${encodeURIComponent(id)}`, key);
}

/** A page link with its key in the fragment, which the browser never sends to a server. */
export function keyedPath(
  route: "facilitate" | "seat" | "screen" | "replays",
  id: string,
  key: string,
) {
  return `/${route}/${encodeURIComponent(id)}#key=${encodeURIComponent(key)}`;
}

/** Links the server returns may be relative or absolute; show them absolute for copying. */
export function absoluteLink(link: string): string {
  if (/^https?:\/\//.test(link)) return link;
  if (typeof window === "undefined") return link;
  return new URL(link, window.location.origin).toString();
}

/** Path, query and fragment of a link, for navigating inside this app whatever origin the server named. */
export function localPath(link: string): string {
  try {
    const u = new URL(link, "http://placeholder.invalid");
    return `${u.pathname}${u.search}${u.hash}`;
  } catch {
    return link;
  }
}
