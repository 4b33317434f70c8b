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

export async function exportJson(baseURL: string, id: string, key?: string): Promise<unknown> {
  const res = await fetch(
    `${baseURL}/api/sessions/${id}/export${key ? `?key=${encodeURIComponent(key)}` : ""}`,
  );
  if (!res.ok) throw new Error(`export ${id}: ${res.status} ${await res.text()}`);
  return res.json();
}

export async function exportCsv(baseURL: string, id: string, key?: string): Promise<string> {
  const q = new URLSearchParams({ format: "csv" });
  if (key) q.set("key", key);
  const res = await fetch(`${baseURL}/api/sessions/${id}/export?${q}`);
  if (!res.ok) throw new Error(`export csv ${id}: ${res.status} ${await res.text()}`);
  return res.text();
}
