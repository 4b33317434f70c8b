/**
 * Abuse limits that hold across connections, per client address, with rate-limiter-flexible.
 * The per-connection token bucket (rateLimit.ts) still smooths each socket; these cap what one
 * address can do with many sockets. Defaults suit a workshop of 64 seats behind one office
 * NAT; the numbers are in docs/security.md. On PostgreSQL the budgets that are not per message
 * (new connections, failed keys, sessions created) are counted in the database (table
 * "RateLimit"), so they hold over every process; if the database does not answer, each process
 * counts in memory meanwhile. Messages per second stay in each process's memory (a database
 * write per socket message would cost more than the flood it stops).
 */
import type { IncomingMessage } from "node:http";
import type pg from "pg";
import { RateLimiterMemory, RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import type { RateLimiterAbstract } from "rate-limiter-flexible";

export interface AbuseLimits {
  /** sockets one address may hold open at once */
  connectionsPerIp: number;
  /** new sockets one address may open per minute */
  connectsPerIpPerMinute: number;
  /** socket messages one address may send per second, over all its sockets */
  messagesPerIpPerSecond: number;
  /** failed join codes and keys one address may try per minute */
  authFailuresPerIpPerMinute: number;
  /** sessions one address may create per hour */
  sessionsPerIpPerHour: number;
  /** behind a reverse proxy: the client is the last address in X-Forwarded-For */
  trustProxy: boolean;
}

export const DEFAULT_ABUSE_LIMITS: AbuseLimits = {
  connectionsPerIp: 200,
  connectsPerIpPerMinute: 400,
  messagesPerIpPerSecond: 400,
  authFailuresPerIpPerMinute: 20,
  sessionsPerIpPerHour: 30,
  trustProxy: false,
};

/** The address the limits count against. */
export function clientAddress(req: IncomingMessage, trustProxy: boolean): string {
  if (trustProxy) {
    const forwarded = req.headers["x-forwarded-for"];
    const list = (Array.isArray(forwarded) ? forwarded.join(",") : (forwarded ?? ""))
      .split(",")
      .map((s) => s.trim())
      .filter((s) => s !== "");
    const last = list.at(-1);
    if (last) return last;
  }
  return req.socket.remoteAddress ?? "unknown";
}

export interface Budget {
  /** takes `points`; false when the address has used its budget up */
  take(address: string, points?: number): Promise<boolean>;
  /** true while the address still has budget, without taking any */
  left(address: string): Promise<boolean>;
}

function budget(
  name: string,
  points: number,
  durationSeconds: number,
  pool: pg.Pool | null = null,
): Budget {
  const inMemory = new RateLimiterMemory({ points, duration: durationSeconds });
  const limiter: RateLimiterAbstract = pool
    ? new RateLimiterPostgres({
        storeClient: pool,
        storeType: "pool",
        tableName: "RateLimit",
        // made by the migrations, not by the library
        tableCreated: true,
        keyPrefix: name,
        points,
        duration: durationSeconds,
        insuranceLimiter: inMemory,
      })
    : inMemory;
  return {
    async take(address, n = 1) {
      try {
        await limiter.consume(address, n);
        return true;
      } catch (rejection) {
        if (rejection instanceof RateLimiterRes) return false;
        throw rejection;
      }
    },
    async left(address) {
      const res = await limiter.get(address);
      return res === null || res.remainingPoints > 0;
    },
  };
}

/** The budgets; with a PostgreSQL pool, all but `messages` are shared by every process. */
export function createAbuseBudgets(limits: AbuseLimits, pool: pg.Pool | null = null) {
  return {
    connects: budget("connects", limits.connectsPerIpPerMinute, 60, pool),
    messages: budget("messages", limits.messagesPerIpPerSecond, 1),
    authFailures: budget("authFailures", limits.authFailuresPerIpPerMinute, 60, pool),
    sessions: budget("sessions", limits.sessionsPerIpPerHour, 3600, pool),
  };
}
export type AbuseBudgets = ReturnType<typeof createAbuseBudgets>;
