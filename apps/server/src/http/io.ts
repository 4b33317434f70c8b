/** Small helpers for reading bounded JSON bodies and writing JSON / text responses. */
import type { IncomingMessage, ServerResponse } from "node:http";

export type BodyResult =
  | { ok: true; value: unknown }
  | { ok: false; status: 400 | 413 | 415; code: "bad-request" | "too-large"; message: string };

/** Reads at most `limit` bytes; stops reading (and answers 413) as soon as the limit is passed. */
export function readJsonBody(req: IncomingMessage, limit: number): Promise<BodyResult> {
  return new Promise((resolve) => {
    const declared = Number(req.headers["content-length"]);
    if (Number.isFinite(declared) && declared > limit) {
      req.resume();
      resolve(tooLarge(limit));
      return;
    }
    // A body without a JSON type is refused: a form or text/plain POST is what a cross-site
    // page can send without asking, so only application/json is read.
    const type = String(req.headers["content-type"] ?? "");
    if (!/^application\/([\w.+-]+\+)?json\b/i.test(type)) {
      req.resume();
      resolve({
        ok: false,
        status: 415,
        code: "bad-request",
        message: "send the body as application/json",
      });
      return;
    }
    const chunks: Buffer[] = [];
    let size = 0;
    let done = false;
    req.on("data", (chunk: Buffer) => {
      if (done) return;
      size += chunk.length;
      if (size > limit) {
        done = true;
        resolve(tooLarge(limit));
        req.resume();
        return;
      }
      chunks.push(chunk);
    });
    req.on("error", () => {
      if (done) return;
      done = true;
      resolve({ ok: false, status: 400, code: "bad-request", message: "could not read the body" });
    });
    req.on("end", () => {
      if (done) return;
      done = true;
      const text = Buffer.concat(chunks).toString("utf8");
      try {
        resolve({ ok: true, value: JSON.parse(text) as unknown });
      } catch {
        resolve({
          ok: false,
          status: 400,
          code: "bad-request",
          message: "the body is not valid JSON",
        });
      }
    });
  });
}

function tooLarge(limit: number): BodyResult {
  return {
    ok: false,
    status: 413,
    code: "too-large",
    message: `the body is larger than ${limit} bytes`,
  };
}

export function sendJson(
  res: ServerResponse,
  status: number,
  body: unknown,
  extraHeaders: Record<string, string> = {},
): void {
  const text = JSON.stringify(body);
  res.writeHead(status, {
    "content-type": "application/json; charset=utf-8",
    "content-length": Buffer.byteLength(text),
    "cache-control": "no-store",
    ...extraHeaders,
  });
  res.end(text);
}

export function sendText(
  res: ServerResponse,
  status: number,
  text: string,
  contentType: string,
  extraHeaders: Record<string, string> = {},
): void {
  res.writeHead(status, {
    "content-type": contentType,
    "content-length": Buffer.byteLength(text),
    "cache-control": "no-store",
    ...extraHeaders,
  });
  res.end(text);
}

/** The REST error shape: {error: {code, path, message}} (path is "" when no field is at fault). */
export function sendError(
  res: ServerResponse,
  status: number,
  code: string,
  message: string,
  path = "",
): void {
  sendJson(res, status, { error: { code, path, message } });
}

/**
 * The key of a request: the Bearer token of its Authorization header. Keys never travel in a
 * query string, where proxies log them and browsers keep them in history.
 */
export function credentialFrom(req: IncomingMessage): string | null {
  const header = req.headers.authorization;
  if (typeof header !== "string") return null;
  const m = /^Bearer\s+(\S+)\s*$/i.exec(header.trim());
  return m?.[1] ?? null;
}
