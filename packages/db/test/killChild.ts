// Child process for restart.test.ts: commits a session and events, reports the commit, then
// dies by SIGKILL without closing anything, as a crashed server would.
import { openDatabase } from "../src/index";
import { note, sessionInput } from "./fixtures";

const dir = process.argv[2]!;
const db = await openDatabase({ url: dir });
const { input, facilitatorKey } = sessionInput();
const created = await db.sessions.create(input);
const appended = await db.events.append(input.id, 1, [note(1, "a"), note(2, "b")]);
if (!created.ok || !appended.ok) throw new Error("child could not write");
process.stdout.write(JSON.stringify({ id: input.id, facilitatorKey }) + "\n", () => {
  process.kill(process.pid, "SIGKILL");
});
