/**
 * Handing a saved version to the editor: the scenarios page keeps it in sessionStorage (this
 * tab only; never in a URL, since a saved scenario may hold private numbers) and opens
 * `/new?from=library`; the editor loads it, and its "Save to library" offers to save the
 * edit as the next version of the same saved scenario.
 */
const HANDOFF = "contend.libraryHandoff";

export interface LibraryOrigin {
  id: string;
  name: string;
  version: number;
}

function session(): Storage | null {
  try {
    return typeof window === "undefined" ? null : window.sessionStorage;
  } catch {
    return null;
  }
}

export function handOver(origin: LibraryOrigin, scenario: unknown): void {
  session()?.setItem(HANDOFF, JSON.stringify({ origin, scenario }));
}

function read(): { origin: LibraryOrigin; scenario: unknown } | null {
  try {
    const raw = JSON.parse(session()?.getItem(HANDOFF) ?? "null") as unknown;
    if (typeof raw !== "object" || raw === null || !("origin" in raw)) return null;
    const { origin, scenario } = raw as { origin: LibraryOrigin; scenario: unknown };
    return typeof origin?.id === "string" ? { origin, scenario } : null;
  } catch {
    return null;
  }
}

/** The scenario handed over, or null. */
export function handedScenario(): unknown {
  return read()?.scenario ?? null;
}

/** Which saved scenario and version the editor was opened from, or null. */
export function handedOrigin(): LibraryOrigin | null {
  return read()?.origin ?? null;
}
