/**
 * Hands page requests to the built Next.js app in apps/web (the documented custom-server
 * set-up), so pages, REST and sockets share one origin and one port.
 */
import { EventEmitter } from "node:events";
import { existsSync } from "node:fs";
import path from "node:path";
import type { IncomingMessage, ServerResponse } from "node:http";
import type { Duplex } from "node:stream";
import type { Logger } from "./logger";

export type NextRequestHandler = (req: IncomingMessage, res: ServerResponse) => Promise<void>;
export type NextUpgradeHandler = (
  req: IncomingMessage,
  socket: Duplex,
  head: Buffer,
) => Promise<void>;

export interface WebApp {
  handle: NextRequestHandler;
  /** only in development: Next's hot-reload socket */
  upgrade: NextUpgradeHandler | null;
  close(): Promise<void>;
}

/** True when `next build` has produced a production build in `dir`. */
export function isWebBuilt(dir: string): boolean {
  return existsSync(path.join(dir, ".next", "BUILD_ID"));
}

export async function loadWebApp(opts: {
  dir: string;
  dev: boolean;
  hostname: string;
  port: number;
  logger: Logger;
}): Promise<WebApp | null> {
  if (!opts.dev && !isWebBuilt(opts.dir)) {
    opts.logger.warn("web app is not built; serving a placeholder page", { dir: opts.dir });
    return null;
  }
  const { default: next } = await import("next");
  // Next attaches its own 'upgrade' listener to whatever server it sees first. Giving it a
  // detached emitter keeps socket.io's upgrades away from it; we forward Next's hot-reload
  // upgrades ourselves in development only.
  const detached = new EventEmitter();
  const app = next({
    dev: opts.dev,
    dir: opts.dir,
    hostname: opts.hostname,
    port: opts.port,
    httpServer: detached as never,
    quiet: !opts.dev,
  });
  await app.prepare();
  const handle = app.getRequestHandler();
  return {
    handle: (req, res) => handle(req, res),
    upgrade: opts.dev ? app.getUpgradeHandler() : null,
    close: () => app.close(),
  };
}

/** Shown when the web app has not been built yet. */
export function placeholderPage(): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Contend server</title>
<style>body{font:16px/1.5 system-ui,sans-serif;max-width:40rem;margin:3rem auto;padding:0 1rem}code{background:#eee;padding:0 .3em}</style>
</head><body>
<h1>Contend server is running</h1>
<p>The web app has not been built, so there are no pages to show yet.
Build it with <code>npm run build -w @contend/web</code> and restart the server.</p>
<p>The live-session API is available: <code>GET /api/health</code>, <code>POST /api/sessions</code>,
<code>GET /api/sessions</code>, and socket.io at <code>/socket.io/</code>.</p>
</body></html>`;
}
