/**
 * The uncertainty tests' shared exact case: two rivals, ratio form r = 1, common value V, rival
 * 0's cost known, rival 1's cost uniform on [A, B]; and the quadrature they compare against.
 */
import type { UncertainScenario } from "../src/uncertain";

export const V = 100;
export const A = 1;
export const B = 3;

/** Two rivals, r = 1, common value V, rival 0's cost c1, rival 1's cost uniform on [A, B]. */
export const twoRivals = (c1 = 1): UncertainScenario => ({
  title: "Two rivals, one unknown cost",
  prize: V,
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "Known", cost: c1 },
    { name: "Unknown", cost: { dist: "uniform", low: A, high: B } },
  ],
});

/** Hillman & Riley 1989; Nti 1999: two rivals, r = 1, common v: e1 = v c2 / (c1 + c2)^2. */
export const closedFormE1 = (c1: number, c2: number) => (V * c2) / (c1 + c2) ** 2;

/** Composite Simpson rule on [a, b] with m (even) panels: the quadrature the checks compare to. */
export function simpson(f: (x: number) => number, a: number, b: number, m = 2000): number {
  const h = (b - a) / m;
  let s = f(a) + f(b);
  for (let k = 1; k < m; k++) s += (k % 2 === 1 ? 4 : 2) * f(a + k * h);
  return (s * h) / 3;
}
