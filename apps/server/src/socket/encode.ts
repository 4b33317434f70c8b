/**
 * Pushed views written once for all the sockets they go to. After a commit every socket of a
 * session gets its own role's patch, and most of those patches carry the same values: the
 * resolved round, the totals, the scenario are the same objects in every role's view
 * (viewFor shares them). socket.io's own encoder writes each socket's packet from scratch, and
 * first walks it looking for binary data. Here the payload of a `view` or `viewPatch` is
 * written as JSON text once per push, each shared object once per push, and carried to
 * socket.io on the payload under a symbol; the server's encoder (socket.io's own, extended)
 * sends that text instead of writing the packet again. The bytes on the wire are exactly
 * what socket.io's encoder would write (test/encode.test.ts), so clients see no difference.
 */
import { Encoder, PacketType } from "socket.io-parser";
import * as parser from "socket.io-parser";
import type { Packet } from "socket.io-parser";
import type { PatchOp, RoleView } from "@contend/protocol";

const WRITTEN = Symbol("contend.written-json");

type Written<T> = T & { [WRITTEN]?: string };

/** The JSON text of objects met during one push, so a value shared by many patches is written once. */
export type TextCache = Map<object, string>;

function valueText(value: unknown, cache: TextCache): string {
  if (typeof value !== "object" || value === null) return JSON.stringify(value);
  let text = cache.get(value);
  if (text === undefined) cache.set(value, (text = JSON.stringify(value)));
  return text;
}

function opText(op: PatchOp, cache: TextCache): string {
  let out = '{"op":' + JSON.stringify(op.op) + ',"path":' + JSON.stringify(op.path);
  if (op.op !== "remove" && op.value !== undefined) out += ',"value":' + valueText(op.value, cache);
  return out + "}";
}

/** A `viewPatch` payload carrying its own JSON text. */
export function patchPayload(seq: number, base: number, ops: PatchOp[], cache: TextCache) {
  const payload: Written<{ seq: number; base: number; ops: PatchOp[] }> = { seq, base, ops };
  let text = '{"seq":' + JSON.stringify(seq) + ',"base":' + JSON.stringify(base) + ',"ops":[';
  for (let i = 0; i < ops.length; i++) text += (i > 0 ? "," : "") + opText(ops[i]!, cache);
  Object.defineProperty(payload, WRITTEN, { value: text + "]}" });
  return payload;
}

/** A `view` payload carrying its own JSON text. */
export function viewPayload(seq: number, view: RoleView, cache: TextCache) {
  const payload: Written<{ seq: number; view: RoleView }> = { seq, view };
  const text = '{"seq":' + JSON.stringify(seq) + ',"view":' + valueText(view, cache) + "}";
  Object.defineProperty(payload, WRITTEN, { value: text });
  return payload;
}

/** socket.io's encoder, sending a payload's own text when it carries one (see above). */
class WrittenEncoder extends Encoder {
  override encode(packet: Packet): Array<string | Buffer> {
    const data = packet.data;
    if (
      packet.type === PacketType.EVENT &&
      (packet.nsp === "/" || !packet.nsp) &&
      packet.id === undefined &&
      Array.isArray(data) &&
      data.length === 2 &&
      typeof data[0] === "string"
    ) {
      const payload = data[1] as Written<object> | null;
      const text = typeof payload === "object" && payload !== null ? payload[WRITTEN] : undefined;
      if (text !== undefined) return [`${PacketType.EVENT}[${JSON.stringify(data[0])},${text}]`];
    }
    return super.encode(packet) as Array<string | Buffer>;
  }
}

/** The `parser` option of the socket.io server: socket.io's own, with the encoder above. */
export const serverParser = { ...parser, Encoder: WrittenEncoder };
