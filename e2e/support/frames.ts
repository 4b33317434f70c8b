/**
 * Records what the server pushes to a page over its socket.io WebSocket, so a test can prove
 * that a sealed effort never reaches anyone but its owner before the round resolves.
 */
import type { Page } from "@playwright/test";

export interface Frame {
  at: number;
  /** the socket.io packet's JSON payload (event name and arguments), or null for pings */
  data: unknown;
  raw: string;
}

/** Starts recording every text frame the page receives on any WebSocket. */
export function recordFrames(page: Page): Frame[] {
  const frames: Frame[] = [];
  page.on("websocket", (ws) => {
    ws.on("framereceived", ({ payload }) => {
      const raw = typeof payload === "string" ? payload : payload.toString("utf8");
      frames.push({ at: Date.now(), data: parsePacket(raw), raw });
    });
  });
  return frames;
}

/** Engine.io "4" (message) + socket.io type digit(s) + optional ack id, then JSON. */
export function parsePacket(raw: string): unknown {
  const start = raw.search(/[[{]/);
  if (start < 0) return null;
  try {
    return JSON.parse(raw.slice(start));
  } catch {
    return null;
  }
}

/** True when `value` holds `target` anywhere: as a number (within tol) or inside a string. */
export function containsNumber(value: unknown, target: number, tol = 1e-9): boolean {
  if (typeof value === "number") return Math.abs(value - target) <= tol;
  if (typeof value === "string") return mentions(value, target);
  if (Array.isArray(value)) return value.some((v) => containsNumber(v, target, tol));
  if (value && typeof value === "object") {
    return Object.values(value).some((v) => containsNumber(v, target, tol));
  }
  return false;
}

/** Frames (received before `until`) that carry any of the given numbers. */
export function framesCarrying(frames: Frame[], targets: number[], until = Infinity): Frame[] {
  return frames.filter(
    (f) => f.at < until && targets.some((t) => containsNumber(f.data, t) || mentions(f.raw, t)),
  );
}

/** `text` spells `n` as a whole number token (so 23.17 is not found inside 123.175). */
export function mentions(text: string, n: number): boolean {
  const token = String(n).replace(".", "\\.");
  return new RegExp(`(?<![\\d.])${token}(?![\\d])`).test(text);
}

/**
 * How many resolved rounds a packet shows, or -1: the longest `rounds` array of a role view
 * anywhere in it, or, in a view patch (RFC 6902), an `add` at `/rounds/k` (k + 1 rounds) or a
 * whole `/rounds` value.
 */
export function roundsIn(value: unknown): number {
  if (Array.isArray(value)) return value.reduce((m: number, v) => Math.max(m, roundsIn(v)), -1);
  if (value && typeof value === "object") {
    const o = value as Record<string, unknown>;
    let best = Array.isArray(o.rounds) && "status" in o ? o.rounds.length : -1;
    if (typeof o.path === "string" && (o.op === "add" || o.op === "replace")) {
      const at = /^\/rounds\/(\d+)$/.exec(o.path);
      if (at && o.op === "add") best = Math.max(best, Number(at[1]) + 1);
      if (o.path === "/rounds" && Array.isArray(o.value)) best = Math.max(best, o.value.length);
    }
    for (const v of Object.values(o)) best = Math.max(best, roundsIn(v));
    return best;
  }
  return -1;
}

/** Frames received before the first one that carries the result of `round` (1-based). */
export function framesBeforeReveal(frames: Frame[], round: number): Frame[] {
  const k = frames.findIndex((f) => roundsIn(f.data) >= round);
  return k < 0 ? frames.slice() : frames.slice(0, k);
}
