/**
 * Small seeded pseudo-random numbers so that every simulated round can be replayed from its
 * seed. mulberry32 (Tommy Ettinger's public-domain generator, common practice, no formal
 * source) is fast, has a 2^32 period and is plenty for drawing winners and behavioural noise;
 * it is not for cryptography.
 */

/** A source of uniform numbers in [0, 1). */
export type Rng = () => number;

export function mulberry32(seed: number): Rng {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Mixes several integers into one 32-bit seed (splitmix32-style finaliser), so that a stream can
 * be derived from (seed, round, rival) without sharing generator state between callers.
 */
export function deriveSeed(...parts: number[]): number {
  let h = 0x9e3779b9;
  for (const p of parts) {
    h = (h ^ (Math.trunc(p) >>> 0)) >>> 0;
    h = Math.imul(h ^ (h >>> 16), 0x85ebca6b) >>> 0;
    h = Math.imul(h ^ (h >>> 13), 0xc2b2ae35) >>> 0;
    h = (h ^ (h >>> 16)) >>> 0;
  }
  return h;
}

/**
 * Draws one winner with probability proportional to `shares` (single-winner outcome mode).
 * Shares need not sum exactly to 1; negative or non-finite entries count as 0. When every share
 * is 0 the winner is drawn uniformly (the equal-split convention of the ratio form).
 */
export function drawWinner(shares: readonly number[], rng: Rng): number {
  if (shares.length === 0) throw new RangeError("drawWinner needs at least one share");
  const clean = shares.map((s) => (Number.isFinite(s) && s > 0 ? s : 0));
  const total = clean.reduce((a, b) => a + b, 0);
  const u = rng();
  if (total === 0) return Math.min(shares.length - 1, Math.floor(u * shares.length));
  let acc = 0;
  const target = u * total;
  for (let i = 0; i < clean.length; i++) {
    acc += clean[i] as number;
    if (target < acc) return i;
  }
  // Floating-point round-off can leave target == total: give it to the last positive share.
  for (let i = clean.length - 1; i >= 0; i--) if ((clean[i] as number) > 0) return i;
  return clean.length - 1;
}
