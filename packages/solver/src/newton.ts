/**
 * Newton's method for a root of a smooth function of one variable, and the typed result every
 * iterative routine of the solver returns: a loop that stops without meeting its tolerance says
 * so instead of handing back its last iterate as if it were the answer.
 */

/** Outcome of an iteration: `ok: false` carries the last iterate only for diagnosis. */
export type Iterated =
  | { ok: true; x: number; iterations: number }
  | { ok: false; x: number; iterations: number; reason: "not-converged" | "not-finite" };

export interface NewtonOptions {
  /** stop when a step is at most relTol * max(1, |x|) */
  relTol: number;
  /** give up after this many steps */
  maxIter: number;
  /** moves a proposed next iterate back onto the branch the root lies on */
  safeguard?: (next: number, x: number) => number;
}

/**
 * Newton iteration x <- x - f(x) / f'(x) from x0. `valueAndSlope` returns [f(x), f'(x)].
 * Converges when the last step was small relative to x.
 */
export function newtonRoot(
  valueAndSlope: (x: number) => readonly [number, number],
  x0: number,
  opts: NewtonOptions,
): Iterated {
  let x = x0;
  for (let it = 1; it <= opts.maxIter; it++) {
    const [f, d] = valueAndSlope(x);
    let step = f / d;
    let next = x - step;
    if (opts.safeguard) {
      const kept = opts.safeguard(next, x);
      if (kept !== next) {
        next = kept;
        step = x - next;
      }
    }
    x = next;
    if (!Number.isFinite(x)) return { ok: false, x, iterations: it, reason: "not-finite" };
    if (Math.abs(step) <= opts.relTol * Math.max(1, Math.abs(x))) {
      return { ok: true, x, iterations: it };
    }
  }
  return { ok: false, x, iterations: opts.maxIter, reason: "not-converged" };
}
