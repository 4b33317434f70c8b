/**
 * A bare socket.io participant for journeys that need a played session as a starting point
 * (the replay journey) without driving every seat through a browser.
 */
import { io, type Socket } from "socket.io-client";

export type Credentials =
  | { role: "facilitator" | "seat" | "spectator"; sessionId: string; key: string }
  | { role: "guest"; joinCode: string };

export interface Ack {
  ok: boolean;
  code?: string;
  message?: string;
  data?: unknown;
}

export interface Participant {
  socket: Socket;
  command(cmd: Record<string, unknown>): Promise<Ack>;
  close(): void;
}

export async function connectAs(origin: string, credentials: Credentials): Promise<Participant> {
  const socket = io(origin, { transports: ["websocket"], reconnection: false, forceNew: true });
  await new Promise<void>((resolve, reject) => {
    socket.once("connect", () => resolve());
    socket.once("connect_error", reject);
  });
  const hello = (await socket
    .timeout(10_000)
    .emitWithAck("hello", { protocol: 2, credentials })) as Ack;
  if (!hello.ok) throw new Error(`hello as ${credentials.role}: ${hello.code} ${hello.message}`);
  return {
    socket,
    async command(cmd) {
      const ack = (await socket.timeout(10_000).emitWithAck("command", cmd)) as Ack;
      if (!ack.ok) throw new Error(`${String(cmd.type)}: ${ack.code} ${ack.message}`);
      return ack;
    },
    close: () => void socket.close(),
  };
}
