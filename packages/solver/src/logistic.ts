/**
 * The logistic function and its softplus companions, written so that no exponential overflows:
 * with E = exp(-|t|), softplus(t) = ln(1 + e^t) = max(t, 0) + ln(1 + E) and
 * sigma(t) = 1 / (1 + e^-t). Used wherever a share s is solved for in t = logit(s).
 */

export interface LogisticParts {
  /** softplus(t) = ln(1 + e^t) = -ln(1 - s) */
  softplus: number;
  /** softplus(-t) = ln(1 + e^-t) = -ln(s) */
  softplusNeg: number;
  /** sigma(t) = s */
  sigma: number;
}

export function logisticParts(t: number): LogisticParts {
  const E = Math.exp(-Math.abs(t));
  const l1p = Math.log1p(E);
  return {
    softplus: (t > 0 ? t : 0) + l1p,
    softplusNeg: (t < 0 ? -t : 0) + l1p,
    sigma: t >= 0 ? 1 / (1 + E) : E / (1 + E),
  };
}

export function sigmoid(t: number): number {
  return t >= 0 ? 1 / (1 + Math.exp(-t)) : Math.exp(t) / (1 + Math.exp(t));
}
