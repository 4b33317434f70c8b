/**
 * Security headers on every response. API answers may be nothing but data; pages get a
 * Content-Security-Policy whose scripts are the app's own plus the inline ones Next writes,
 * which carry a per-request nonce (Next reads it from the request's CSP header). No page may
 * be framed (`frame-ancestors 'none'`, the big screen included: it is opened, not embedded).
 */
import { randomBytes } from "node:crypto";
import type { IncomingMessage, ServerResponse } from "node:http";

const COMMON: Record<string, string> = {
  "x-content-type-options": "nosniff",
  "referrer-policy": "no-referrer",
  "x-frame-options": "DENY",
  "cross-origin-opener-policy": "same-origin",
};

/** For JSON, CSV and the placeholder page: nothing runs, nothing loads, nothing frames it. */
export const API_CSP = "default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'none'";

/** The page policy with this request's nonce; development adds what Next's hot reload needs. */
export function pageCsp(nonce: string, dev: boolean): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    // React and Next set style attributes; styles cannot run script.
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self' ws: wss:",
    "object-src 'none'",
    "base-uri 'none'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

export function setApiHeaders(res: ServerResponse): void {
  for (const [name, value] of Object.entries(COMMON)) res.setHeader(name, value);
  res.setHeader("content-security-policy", API_CSP);
}

/**
 * Headers for a page request: the response gets the policy, and so does the request (that is
 * where Next looks for the nonce to put on its own inline scripts).
 */
export function setPageHeaders(req: IncomingMessage, res: ServerResponse, dev: boolean): void {
  const csp = pageCsp(randomBytes(16).toString("base64"), dev);
  for (const [name, value] of Object.entries(COMMON)) res.setHeader(name, value);
  res.setHeader("content-security-policy", csp);
  req.headers["content-security-policy"] = csp;
  delete req.headers["content-security-policy-report-only"];
}
