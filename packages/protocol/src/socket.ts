/** socket.io event maps, typed once for the server and the web client. */
import type { Ack, CommandAckData, HelloAckData } from "./ack";
import type { Command } from "./commands";
import type { Hello } from "./hello";
import type { ViewMessage } from "./view";

export interface ClientToServerEvents {
  /** first message on every connection, and again after each reconnect */
  hello: (msg: Hello, ack: (res: Ack<HelloAckData>) => void) => void;
  command: (cmd: Command, ack: (res: Ack<CommandAckData>) => void) => void;
}

export interface ServerToClientEvents {
  /** the sender's role view after every committed change */
  view: (msg: ViewMessage) => void;
}
