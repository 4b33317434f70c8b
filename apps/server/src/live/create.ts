/**
 * Creating a session: draw its id, join code, seed and keys, build the first event with the
 * engine, and store everything in one transaction. Keys are returned once, here, in plain
 * text; the database keeps only their hashes.
 */
import { randomBytes } from "node:crypto";
import type { Database, KeyInput } from "@contend/db";
import { newJoinCode, newKey } from "@contend/db";
import type { AnySessionScenario, CreateSessionResponse } from "@contend/protocol";
import { createSession } from "@contend/session";
import { sessionLinks } from "./links";

/** Random session id: 16 bytes, base64url (22 characters). */
function newSessionId(): string {
  return randomBytes(16).toString("base64url");
}

const ATTEMPTS = 5;

export async function createLiveSession(
  db: Database,
  scenario: AnySessionScenario,
  opts: { now: number; baseUrl: string },
): Promise<CreateSessionResponse> {
  for (let attempt = 0; attempt < ATTEMPTS; attempt++) {
    const id = newSessionId();
    const joinCode = newJoinCode();
    const seed = randomBytes(4).readUInt32LE(0);
    const first = createSession({ sessionId: id, scenario, seed });
    const facilitatorKey = newKey();
    const spectatorKey = newKey();
    const seatKeys = first.seats.map((s) => (s.kind === "human" ? newKey() : null));
    const keys: KeyInput[] = [
      { role: "facilitator", seatIndex: null, plaintext: facilitatorKey },
      { role: "spectator", seatIndex: null, plaintext: spectatorKey },
      ...seatKeys.flatMap((key, index) =>
        key ? [{ role: "seat" as const, seatIndex: index, plaintext: key }] : [],
      ),
    ];
    const { type, ...payload } = first;
    const result = await db.sessions.create({
      id,
      joinCode,
      title: scenario.title,
      status: "lobby",
      scenario,
      seats: first.seats.map((s) => ({ index: s.index, name: s.name, kind: s.kind })),
      keys,
      firstEvent: { type, at: opts.now, payload },
    });
    if (!result.ok) continue; // id or join code taken: draw again
    const links = sessionLinks(opts.baseUrl, id, joinCode);
    return {
      id,
      joinCode,
      facilitatorKey,
      spectatorKey,
      seats: first.seats.map((s, i) => {
        const key = seatKeys[i] ?? null;
        return {
          index: s.index,
          name: s.name,
          kind: s.kind,
          key,
          link: key ? links.seat(key) : null,
        };
      }),
      links: {
        facilitator: links.facilitator(facilitatorKey),
        spectator: links.spectator(spectatorKey),
        join: links.join,
      },
    };
  }
  throw new Error(`could not draw a free session id and join code in ${ATTEMPTS} attempts`);
}
