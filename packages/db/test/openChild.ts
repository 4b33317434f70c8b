// Child process for migrate-race.test.ts: opens the database named on the command line, as a
// starting server does, prints the migrations this open applied, and closes.
import { openDatabase } from "../src/index";

const db = await openDatabase({ url: process.argv[2]! });
process.stdout.write(JSON.stringify(db.migrationsApplied) + "\n");
await db.close();
