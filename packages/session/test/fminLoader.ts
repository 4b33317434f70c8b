// fmin ships a UMD bundle inside a "type": "module" package; loaded as ESM it exports nothing
// and registers itself on globalThis.fmin instead. This helper hides that quirk from tests.
//
// fmin 0.0.4 also assigns an undeclared loop variable `i` in the Nelder-Mead shrink step,
// which throws under ESM strict mode; a global binding named `i` lets that assignment succeed.
(globalThis as unknown as { i: number }).i = 0;
await import("fmin");

export interface NelderMeadResult {
  x: number[];
  fx: number;
}

interface Fmin {
  nelderMead(
    f: (x: number[]) => number,
    x0: number[],
    parameters?: { maxIterations?: number; minErrorDelta?: number; zeroDelta?: number },
  ): NelderMeadResult;
}

const fmin = (globalThis as unknown as { fmin: Fmin }).fmin;
export default fmin;
