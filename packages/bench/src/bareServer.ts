/**
 * Transport baseline: a bare socket.io server on the same machine, with no validation, engine,
 * database or solver. It answers the same messages as the real server the way the transport
 * alone would: hello joins a room and acks; every command is acknowledged at once and, like a
 * real commit, pushes one view of VIEW_BYTES to every socket of the room; when SEATS seals are
 * in (or the facilitator closes) the pushed view reveals the round. As in the real server, a
 * seal that does not reveal goes at once only to the sealer and to the rest of the room within
 * PROGRESS_MS, merged with the other seals of that window (0: to everyone at once). The real
 * server stretches its window while its event loop is near full; this one's loop never is
 * (40-43% of a core in the full run, below where the window starts to stretch), so the same
 * rule would keep PROGRESS_MS here.
 * With DURABLE_URL (a PostgreSQL URL) it is the durable baseline: every command is first
 * stored with one INSERT into the same database the real server uses, and only after that
 * commit is it pushed and acknowledged, as the real server acknowledges after its commit.
 *   PORT=... HOST=127.0.0.1 SEATS=8 VIEW_BYTES=4000 PROGRESS_MS=200 [DURABLE_URL=postgres://...] \
 *     node --import tsx src/bareServer.ts
 */
import { createServer } from "node:http";
import pg from "pg";
import { Server } from "socket.io";

const port = Number(process.env.PORT ?? 0);
const host = process.env.HOST ?? "127.0.0.1";
const seats = Number(process.env.SEATS ?? 8);
const viewBytes = Number(process.env.VIEW_BYTES ?? 2000);
const progressMs = Number(process.env.PROGRESS_MS ?? 200);
const durableUrl = process.env.DURABLE_URL || null;
// One pool of node-postgres's default size, as the real server's.
const pool = durableUrl ? new pg.Pool({ connectionString: durableUrl }) : null;
if (pool) {
  await pool.query(
    `CREATE TABLE IF NOT EXISTS "BareMove" ("id" bigserial PRIMARY KEY, "sessionId" text NOT NULL,
     "seatIndex" int, "type" text NOT NULL, "payload" jsonb NOT NULL, "at" timestamptz NOT NULL DEFAULT now())`,
  );
}

/** The durable baseline's one INSERT per command, committed before anything is sent. */
async function store(sessionId: string, seatIndex: number | null, cmd: { type: string }) {
  if (!pool) return;
  await pool.query(
    `INSERT INTO "BareMove" ("sessionId", "seatIndex", "type", "payload") VALUES ($1, $2, $3, $4)`,
    [sessionId, seatIndex, cmd.type, JSON.stringify(cmd)],
  );
}

interface Room {
  seq: number;
  status: "lobby" | "open" | "review";
  round: number;
  sealed: Set<number>;
  rounds: Array<{ round: number }>;
  /** the room push waiting for the end of the progress window */
  pending: ReturnType<typeof setTimeout> | null;
  /** the socket that already holds the latest progress (the real server skips it too) */
  lastSealer: string | null;
}

const rooms = new Map<string, Room>();
const pad = "x".repeat(Math.max(0, viewBytes - 120));

function viewOf(room: Room) {
  return { status: room.status, round: room.round, rounds: room.rounds, pad };
}

const http = createServer((req, res) => {
  if (req.url === "/health") {
    res.writeHead(200, { "content-type": "application/json" });
    res.end('{"ok":true}');
  } else {
    res.writeHead(404);
    res.end();
  }
});
const io = new Server(http, { serveClient: false });

type Ack = (res: unknown) => void;

io.on("connection", (socket) => {
  let sessionId: string | null = null;
  let seatIndex: number | null = null;

  function push(room: Room) {
    room.seq++;
    if (room.pending) clearTimeout(room.pending);
    room.pending = null;
    io.to(sessionId!).emit("view", { seq: room.seq, view: viewOf(room) });
  }

  function pushProgress(room: Room) {
    room.seq++;
    socket.emit("view", { seq: room.seq, view: viewOf(room) });
    room.lastSealer = socket.id;
    const id = sessionId!;
    room.pending ??= setTimeout(() => {
      room.pending = null;
      io.to(id)
        .except(room.lastSealer ?? [])
        .emit("view", { seq: room.seq, view: viewOf(room) });
    }, progressMs);
  }

  socket.on("hello", (msg: { credentials: { sessionId: string; key: string } }, ack: Ack) => {
    sessionId = msg.credentials.sessionId;
    // bare keys are "seat:<index>" or "facilitator"
    const m = /^seat:(\d+)$/.exec(msg.credentials.key);
    seatIndex = m ? Number(m[1]) : null;
    let room = rooms.get(sessionId);
    if (!room) {
      room = {
        seq: 1,
        status: "lobby",
        round: 0,
        sealed: new Set(),
        rounds: [],
        pending: null,
        lastSealer: null,
      };
      rooms.set(sessionId, room);
    }
    void socket.join(sessionId);
    ack({ ok: true, data: { seq: room.seq, seatIndex, view: viewOf(room) } });
  });

  socket.on(
    "command",
    async (cmd: { type: string; clientMoveId?: string; effort?: number }, ack: Ack) => {
      const room = sessionId ? rooms.get(sessionId) : undefined;
      if (!room) return ack({ ok: false, code: "unauthorized" });
      try {
        await store(sessionId!, seatIndex, cmd);
      } catch {
        return ack({ ok: false, code: "internal" });
      }
      if (cmd.type === "openRound") {
        room.status = "open";
        room.round++;
        room.sealed.clear();
        push(room);
        return ack({ ok: true, data: { seq: room.seq } });
      }
      const reveal = () => {
        room.status = "review";
        room.rounds.push({ round: room.round });
      };
      if (cmd.type === "closeRound") {
        reveal();
        push(room);
        return ack({ ok: true, data: { seq: room.seq } });
      }
      if (cmd.type === "sealMove" && seatIndex !== null) {
        room.sealed.add(seatIndex);
        if (room.sealed.size >= seats && room.status === "open") {
          reveal();
          push(room);
        } else if (progressMs > 0) pushProgress(room);
        else push(room);
        return ack({
          ok: true,
          data: {
            seq: room.seq,
            round: room.round,
            seatIndex,
            clientMoveId: cmd.clientMoveId,
            effort: cmd.effort,
          },
        });
      }
      ack({ ok: false, code: "bad-request" });
    },
  );
});

http.listen(port, host);
process.on("SIGTERM", () => io.close(() => process.exit(0)));
