// Minimal typing for the parts of fmin (Nelder-Mead) the benchmark uses.
// fmin 0.0.4 points "main" at a UMD build inside a "type": "module" package, so Node cannot
// import it by name; the benchmark imports the ES source file directly (tsx resolves it).
declare module "fmin/src/nelderMead.js" {
  export interface NelderMeadResult {
    x: number[];
    fx: number;
  }
  export function nelderMead(
    f: (x: number[]) => number,
    x0: number[],
    parameters?: { maxIterations?: number; minErrorDelta?: number; minTolerance?: number },
  ): NelderMeadResult;
}
