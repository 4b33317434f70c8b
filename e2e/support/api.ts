/**
 * Direct REST calls a journey uses to set things up or to cross-check what a page shows
 * against what the server stores (the same endpoints any client uses).
 */
export interface CreatedSession {
  id: string;
  joinCode: string;
  facilitatorKey: string;
  spectatorKey: string;
  seats: {
    index: number;
    name: string;
    kind: "human" | "computer";
    key: string | null;
    link: string | null;
  }[];
  links: { facilitator: string; spectator: string; join: string };
}

export async function createSession(baseURL: string, scenario: unknown): Promise<CreatedSession> {
  const res = await fetch(`${baseURL}/api/sessions`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(scenario),
  });
  if (res.status !== 201) throw new Error(`POST /api/sessions: ${res.status} ${await res.text()}`);
  return (await res.json()) as CreatedSession;
}

/**
 * The operator key every journey's server starts with (support/server.ts): it exports any
 * session. A test-only value for a server on loopback that lives for one run.
 */
export const E2E_OPERATOR_KEY = "e2e-operator-key-for-loopback-runs-only";

/** Keys travel only in the Authorization header (REST reads no key from a URL). */
function bearer(key: string | undefined) {
  return { headers: { authorization: `Bearer ${key ?? E2E_OPERATOR_KEY}` } };
}

export async function exportJson(baseURL: string, id: string, key?: string): Promise<unknown> {
  const res = await fetch(`${baseURL}/api/sessions/${id}/export`, bearer(key));
  if (!res.ok) throw new Error(`export ${id}: ${res.status} ${await res.text()}`);
  return res.json();
}

export async function exportCsv(baseURL: string, id: string, key?: string): Promise<string> {
  const res = await fetch(`${baseURL}/api/sessions/${id}/export?format=csv`, bearer(key));
  if (!res.ok) throw new Error(`export csv ${id}: ${res.status} ${await res.text()}`);
  return res.text();
}
