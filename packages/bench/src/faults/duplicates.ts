/**
 * Fault 2: duplicate and out-of-order commands.
 */
import { isDeepStrictEqual } from "node:util";
import { createSession, exportEvents, kioskScenario } from "../api";
import type { SessionClient } from "../client";
import type { AckLike } from "../client";
import { check, closeTable, newServer, seatTable } from "./common";
import type { Check, FaultReport } from "./common";

export async function duplicatesRun(): Promise<FaultReport> {
  const { server } = await newServer();
  try {
    const created = await createSession(server.url, kioskScenario(3, 2));
    const t = await seatTable(server.url, created);
    const [s0, s1, s2] = t.seats as [SessionClient, SessionClient, SessionClient];
    const checks: Check[] = [];
    const expectCode = (name: string, ack: AckLike, code: string) =>
      checks.push(
        check(name, code, ack.ok ? "ok" : String(ack.code), !ack.ok && ack.code === code),
      );
    const before = await exportEvents(server.url, created.id);

    expectCode(
      "seal before any round is open",
      await s0.command({ type: "sealMove", clientMoveId: "early", effort: 5 }),
      "wrong-state",
    );
    expectCode(
      "close before any round is open",
      await t.facilitator.command({ type: "closeRound" }),
      "wrong-state",
    );
    const afterEarly = await exportEvents(server.url, created.id);
    checks.push(
      check(
        "log unchanged by refused commands",
        `${before.length} events`,
        `${afterEarly.length} events`,
        isDeepStrictEqual(before, afterEarly),
      ),
    );

    const opened = await t.facilitator.command({ type: "openRound", durationSeconds: null });
    checks.push(check("open round 1", "ok", opened.ok ? "ok" : String(opened.code), opened.ok));
    expectCode(
      "open again while open",
      await t.facilitator.command({ type: "openRound", durationSeconds: null }),
      "wrong-state",
    );
    expectCode(
      "seal for round 2 while round 1 is open",
      await s0.command({ type: "sealMove", clientMoveId: "r2", effort: 5, round: 2 }),
      "wrong-state",
    );
    expectCode(
      "seat sends a facilitator command",
      await s0.command({ type: "closeRound" }),
      "forbidden",
    );
    expectCode(
      "facilitator sends a seat command",
      await t.facilitator.command({ type: "sealMove", clientMoveId: "f", effort: 1 }),
      "forbidden",
    );

    const first = await s0.command({
      type: "sealMove",
      clientMoveId: "dup-1",
      effort: 10,
      round: 1,
    });
    const repeats = await Promise.all(
      Array.from({ length: 20 }, () =>
        s0.command({ type: "sealMove", clientMoveId: "dup-1", effort: 10, round: 1 }),
      ),
    );
    const sameAcks = repeats.filter((a) => isDeepStrictEqual(a, first)).length;
    checks.push(
      check(
        "same clientMoveId sent 20 more times: same ack",
        "20 identical",
        `${sameAcks} identical`,
        first.ok && sameAcks === 20,
      ),
    );
    const changed = await s0.command({
      type: "sealMove",
      clientMoveId: "dup-1",
      effort: 99,
      round: 1,
    });
    checks.push(
      check(
        "same clientMoveId with another effort keeps the first move",
        "ack with effort 10",
        changed.ok ? `ack with effort ${String(changed.data?.effort)}` : String(changed.code),
        changed.ok && changed.data?.effort === 10,
      ),
    );
    const replaced = await s1.command({ type: "sealMove", clientMoveId: "a", effort: 7, round: 1 });
    const replaced2 = await s1.command({
      type: "sealMove",
      clientMoveId: "b",
      effort: 8,
      round: 1,
    });
    checks.push(
      check(
        "new clientMoveId before close replaces the move",
        "ok, ok",
        `${replaced.ok ? "ok" : replaced.code}, ${replaced2.ok ? "ok" : replaced2.code}`,
        replaced.ok && replaced2.ok,
      ),
    );

    const reveal = t.facilitator.waitForView((v) => v.rounds.length >= 1, 10_000);
    await s2.command({ type: "sealMove", clientMoveId: "c", effort: 9, round: 1 });
    const revealedAt = await reveal;
    checks.push(
      check(
        "round closes when all sealed",
        "revealed",
        revealedAt !== null ? "revealed" : "not revealed",
        revealedAt !== null,
      ),
    );
    expectCode(
      "close after the round closed",
      await t.facilitator.command({ type: "closeRound" }),
      "wrong-state",
    );
    expectCode("close twice", await t.facilitator.command({ type: "closeRound" }), "wrong-state");
    expectCode(
      "late seal for the closed round",
      await s0.command({ type: "sealMove", clientMoveId: "late", effort: 3, round: 1 }),
      "wrong-state",
    );

    const log = await exportEvents(server.url, created.id);
    const seals = log.filter((e) => e.type === "move-sealed" && e.round === 1);
    const resolved = log.filter((e) => e.type === "round-resolved");
    const efforts = (resolved[0]?.efforts as number[] | undefined) ?? [];
    checks.push(
      check(
        "move-sealed events in round 1",
        "4 (dup-1 once, a, b, c)",
        seals.length,
        seals.length === 4,
      ),
    );
    checks.push(
      check(
        "resolved efforts",
        "[10, 8, 9]",
        JSON.stringify(efforts),
        isDeepStrictEqual(efforts, [10, 8, 9]),
      ),
    );
    checks.push(check("one round-resolved", "1", resolved.length, resolved.length === 1));
    const seqs = log.map((e) => e.seq);
    checks.push(
      check(
        "seqs 1..n without gaps",
        `1..${log.length}`,
        `${seqs[0]}..${seqs[seqs.length - 1]}`,
        seqs.every((s, i) => s === i + 1),
      ),
    );
    closeTable(t);
    return {
      name: "duplicates and out-of-order",
      tried:
        "one session of 3 seats: seal and close before open, open twice, seal for the wrong round, wrong roles, 21 sends of one clientMoveId (20 at once), a changed effort under the same id, a replaced move, close twice, a late seal.",
      figures: [["events in the log at the end", log.length]],
      checks,
    };
  } finally {
    await server.kill("SIGKILL");
  }
}
