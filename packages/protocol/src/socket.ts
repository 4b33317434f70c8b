/** socket.io event maps, typed once for the server and the web client. */
import type { Ack, CommandAckData, HelloAckData } from "./ack";
import type { Command } from "./commands";
import type { Hello } from "./hello";
import type { ViewMessage } from "./view";
import type { ViewPatchMessage } from "./viewPatch";

export interface ClientToServerEvents {
  /** first message on every connection, and again after each reconnect */
  hello: (msg: Hello, ack: (res: Ack<HelloAckData>) => void) => void;
  command: (cmd: Command, ack: (res: Ack<CommandAckData>) => void) => void;
}

export interface ServerToClientEvents {
  /** a full role view (when a patch would not be smaller) */
  view: (msg: ViewMessage) => void;
  /** after every committed change: the patch from the view this connection holds */
  viewPatch: (msg: ViewPatchMessage) => void;
  /**
   * facilitator only, after its hello ack and whenever a seat gets its first connected page or
   * loses its last: the seats (indices, ascending) with at least one connected seat page
   */
  presence: (msg: PresenceMessage) => void;
  /**
   * This connection's key no longer opens the session (a new link was issued for its seat,
   * or the session was deleted); the server closes the connection right after.
   */
  revoked: (msg: RevokedMessage) => void;
}

export interface RevokedMessage {
  reason: "new-link" | "session-deleted";
  /** a sentence to show as it is */
  message: string;
}

/** Who is connected right now. Not an event: it is never logged, exported or replayed. */
export interface PresenceMessage {
  seats: number[];
}
