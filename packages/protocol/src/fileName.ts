/**
 * File names for downloads (session exports, scenario files): the title in lower-case ASCII
 * words joined by hyphens, then the date, then the extension, e.g.
 * `harbour-ferry-tender-2026-12-04.csv`. One rule for the server's exports and the web's
 * own downloads.
 */

/** The title as a file-name stem: ASCII letters and digits joined by hyphens, at most 60 characters. */
export function fileStem(title: string, fallback = "session"): string {
  const stem = title
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60)
    .replace(/-+$/, "");
  return stem || fallback;
}

/** `<stem>-<YYYY-MM-DD>.<ext>` (the date in UTC), or `<stem>.<ext>` without a date. */
export function downloadFileName(title: string, ext: string, date?: Date | string): string {
  const d = date === undefined ? null : new Date(date);
  const day = d && Number.isFinite(d.getTime()) ? `-${d.toISOString().slice(0, 10)}` : "";
  return `${fileStem(title)}${day}.${ext}`;
}

/** A `Content-Disposition` header value that makes a browser save the body as `fileName`. */
export function attachmentHeader(fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]|["\\]/g, "_");
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}
