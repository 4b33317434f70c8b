/** The shapes the socket modules share: who a connection is and what it holds. */
import type { Server, Socket } from "socket.io";
import type {
  Ack,
  ClientToServerEvents,
  Role,
  RoleView,
  ServerToClientEvents,
} from "@contend/protocol";
import type { Viewer } from "@contend/session";
import type { TokenBucket } from "../rateLimit";

export interface Identity {
  role: Role;
  sessionId: string;
  seatIndex?: number;
  /** facilitator only: shown in its view (the facilitator is trusted with it) */
  joinCode?: string;
  /** seat only: the key this connection said hello with (a claim of its own seat returns it) */
  key?: string;
}

export interface SocketData {
  bucket: TokenBucket;
  /** the client address the per-address limits count against */
  address: string;
  identity: Identity | null;
  /** consecutive rate-limited messages; a client that keeps flooding is disconnected */
  strikes: number;
  /** the view this connection holds (hello ack or last push): the base of the next patch */
  shown: { seq: number; view: RoleView } | null;
}

export type AppSocket = Socket<
  ClientToServerEvents,
  ServerToClientEvents,
  Record<string, never>,
  SocketData
>;
export type AppServer = Server<
  ClientToServerEvents,
  ServerToClientEvents,
  Record<string, never>,
  SocketData
>;

export type AnyAck = (res: Ack<unknown>) => void;

export function viewerOf(identity: Identity): Viewer {
  if (identity.role === "seat") return { role: "seat", seatIndex: identity.seatIndex as number };
  if (identity.role === "facilitator" && identity.joinCode !== undefined) {
    return { role: "facilitator", joinCode: identity.joinCode };
  }
  return { role: identity.role };
}
