/** REST calls to the Contend server (same origin unless NEXT_PUBLIC_SERVER_URL says otherwise). */
import type { CreateSessionResponse, SessionListItem } from "@contend/protocol";
import type { SessionScenarioInput } from "./session-types";

export type ApiResult<T> =
  | { ok: true; data: T }
  | { ok: false; status: number; code: string; path: string; message: string };

/** Always same-origin: under `next dev` with NEXT_PUBLIC_SERVER_URL, next.config rewrites /api/*. */
export function apiUrl(path: string): string {
  return path;
}

async function readError(res: Response): Promise<{ code: string; path: string; message: string }> {
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

async function request<T>(path: string, init?: RequestInit): Promise<ApiResult<T>> {
  let res: Response;
  try {
    res = await fetch(apiUrl(path), {
      ...init,
      headers: { accept: "application/json", ...(init?.headers ?? {}) },
    });
  } catch (e) {
    return {
      ok: false,
      status: 0,
      code: "network",
      path: "",
      message: `cannot reach the server (${(e as Error).message})`,
    };
  }
  if (!res.ok) return { ok: false, status: res.status, ...(await readError(res)) };
  return { ok: true, data: (await res.json()) as T };
}

export function createSession(
  scenario: SessionScenarioInput,
): Promise<ApiResult<CreateSessionResponse>> {
  return request<CreateSessionResponse>("/api/sessions", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(scenario),
  });
}

function keyQuery(key: string | undefined, first: boolean): string {
  return key ? `${first ? "?" : "&"}key=${encodeURIComponent(key)}` : "";
}

/** GET /api/sessions; `key` is the admin key when the server requires one. */
export function listSessions(key?: string): Promise<ApiResult<SessionListItem[]>> {
  return request<SessionListItem[]>(`/api/sessions${keyQuery(key, true)}`);
}

/** Raw export body; the caller validates it with the protocol schema. */
export function exportSession(id: string, key?: string): Promise<ApiResult<unknown>> {
  return request<unknown>(`/api/sessions/${encodeURIComponent(id)}/export${keyQuery(key, true)}`);
}

export function exportCsvUrl(id: string, key?: string): string {
  return apiUrl(`/api/sessions/${encodeURIComponent(id)}/export?format=csv${keyQuery(key, false)}`);
}

export function exportJsonUrl(id: string, key?: string): string {
  return apiUrl(`/api/sessions/${encodeURIComponent(id)}/export${keyQuery(key, true)}`);
}

/** Links the server returns may be relative or absolute; show them absolute for copying. */
export function absoluteLink(link: string): string {
  if (/^https?:\/\//.test(link)) return link;
  if (typeof window === "undefined") return link;
  return new URL(link, window.location.origin).toString();
}

/** Path and query of a link, for navigating inside this app whatever origin the server named. */
export function localPath(link: string): string {
  try {
    const u = new URL(link, "http://placeholder.invalid");
    return `${u.pathname}${u.search}`;
  } catch {
    return link;
  }
}
