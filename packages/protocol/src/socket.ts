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
}
