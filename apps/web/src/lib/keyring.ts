/**
 * Keys this browser holds. A page's key arrives in the URL fragment (`#key=`), which browsers
 * never send to a server; facilitator keys are also kept in localStorage so that the replays
 * page can list this browser's own sessions, and library keys of saved scenarios so that the
 * scenario library lists this browser's own. Nothing else is stored.
 */
const FACILITATOR_KEYS = "contend.facilitatorKeys";
/** Library keys of saved scenarios this browser saved (each opens one saved scenario). */
const SCENARIO_KEYS = "contend.scenarioKeys";
/** At most this many sessions are remembered (the server answers at most 200 at once). */
const MAX_REMEMBERED = 200;

/** The `key` of a fragment such as `#key=abc`; empty when absent. */
export function keyFromFragment(hash: string): string {
  const params = new URLSearchParams(hash.startsWith("#") ? hash.slice(1) : hash);
  return params.get("key") ?? "";
}

export interface HeldKey {
  id: string;
  key: string;
}

function read(storage: Storage | null, item = FACILITATOR_KEYS): HeldKey[] {
  if (!storage) return [];
  try {
    const raw = JSON.parse(storage.getItem(item) ?? "[]") as unknown;
    if (!Array.isArray(raw)) return [];
    return raw.filter(
      (x): x is HeldKey =>
        typeof x === "object" &&
        x !== null &&
        typeof (x as HeldKey).id === "string" &&
        typeof (x as HeldKey).key === "string",
    );
  } catch {
    return [];
  }
}

function storage(): Storage | null {
  try {
    return typeof window === "undefined" ? null : window.localStorage;
  } catch {
    return null;
  }
}

export function facilitatorKeys(): HeldKey[] {
  return read(storage());
}

/** Remembers (or refreshes) the facilitator key of a session, newest first. */
export function rememberFacilitatorKey(id: string, key: string): void {
  const store = storage();
  if (!store || id === "" || key === "") return;
  const rest = read(store).filter((k) => k.id !== id);
  store.setItem(FACILITATOR_KEYS, JSON.stringify([{ id, key }, ...rest].slice(0, MAX_REMEMBERED)));
}

/** Forgets a session (after it was deleted). */
export function forgetFacilitatorKey(id: string): void {
  const store = storage();
  if (!store) return;
  store.setItem(FACILITATOR_KEYS, JSON.stringify(read(store).filter((k) => k.id !== id)));
}

export function scenarioKeys(): HeldKey[] {
  return read(storage(), SCENARIO_KEYS);
}

/** Remembers the library key of a saved scenario (shown once by the server), newest first. */
export function rememberScenarioKey(id: string, key: string): void {
  const store = storage();
  if (!store || id === "" || key === "") return;
  const rest = read(store, SCENARIO_KEYS).filter((k) => k.id !== id);
  store.setItem(SCENARIO_KEYS, JSON.stringify([{ id, key }, ...rest].slice(0, MAX_REMEMBERED)));
}

export function forgetScenarioKey(id: string): void {
  const store = storage();
  if (!store) return;
  store.setItem(
    SCENARIO_KEYS,
    JSON.stringify(read(store, SCENARIO_KEYS).filter((k) => k.id !== id)),
  );
}
