import type { IncomingMessage } from "node:http";

/**
 * The web pages a session's participants open. Keys travel in the URL fragment (`#key=`),
 * which browsers never send to a server: no server or proxy log, no Referer and no page
 * request carries them; the page reads it and sends it in its hello.
 */
export function sessionLinks(baseUrl: string, sessionId: string, joinCode: string) {
  const base = baseUrl.replace(/\/+$/, "");
  const id = encodeURIComponent(sessionId);
  const q = (key: string) => `#key=${encodeURIComponent(key)}`;
  return {
    facilitator: (key: string) => `${base}/facilitate/${id}${q(key)}`,
    seat: (key: string) => `${base}/seat/${id}${q(key)}`,
    spectator: (key: string) => `${base}/screen/${id}${q(key)}`,
    join: `${base}/join?code=${encodeURIComponent(joinCode)}`,
  };
}

/** Links point at PUBLIC_URL when set, else at the address the client used. */
export function baseUrlOf(publicUrl: string | null, req: IncomingMessage): string {
  if (publicUrl) return publicUrl;
  const host = req.headers.host ?? "localhost";
  return `http://${host}`;
}
