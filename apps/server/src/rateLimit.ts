/**
 * Token bucket (common practice, no source): `ratePerSecond` tokens refill continuously up to
 * `burst`; each message takes one. Time comes from the caller so tests need no sleeping.
 */
export interface TokenBucket {
  take(nowMs: number): boolean;
}

export function createTokenBucket(
  ratePerSecond: number,
  burst: number,
  nowMs: number,
): TokenBucket {
  let tokens = burst;
  let last = nowMs;
  return {
    take(now) {
      const elapsed = Math.max(0, now - last);
      last = Math.max(last, now);
      tokens = Math.min(burst, tokens + (elapsed * ratePerSecond) / 1000);
      if (tokens < 1) return false;
      tokens -= 1;
      return true;
    },
  };
}
