/**
 * The one place the web app reads its environment. NEXT_PUBLIC_ variables are inlined at build
 * time, so they must be referenced literally.
 *
 * NEXT_PUBLIC_SERVER_URL: origin of the Contend server when `next dev` runs on its own
 * (e.g. http://localhost:3001). Empty (the default) means the same origin, which is how the
 * built app is served by apps/server.
 */
const raw = process.env.NEXT_PUBLIC_SERVER_URL ?? "";

function clean(url: string): string {
  const t = url.trim().replace(/\/+$/, "");
  if (t === "") return "";
  return /^https?:\/\/[^\s/]+(:\d+)?(\/.*)?$/.test(t) ? t : "";
}

export const SERVER_URL = clean(raw);
