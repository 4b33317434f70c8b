/**
 * The solver's dispatcher: picks the right method for the contest and always reports the
 * measured Nash gap of what it returns.
 *   leader set            -> leader-follower (Dixit 1987)
 *   all-pay               -> mixed equilibria (Hillman & Riley 1989; Baye, Kovenock & de Vries 1996)
 *   ratio, every r_i <= 1 -> closed forms where they apply, else the share-function method
 *   ratio with r_i > 1    -> active-set search with global verification
 *   logit                 -> candidate enumeration with global verification
 */
import { hillmanRileyEquilibrium } from "./hillmanRiley";
import { ntiTwoRival } from "./ntiTwoRival";
import { noPureEquilibrium, pureEquilibrium } from "./pureEquilibrium";
import { shareFunctionEquilibrium } from "./shareFunction";
import { identicalRivals, symmetricRatioEquilibrium } from "./symmetricRatio";
import type { Contest, Equilibrium, SolveOptions, SolveResult } from "./types";

export function solve(contest: Contest, opts: SolveOptions = {}): SolveResult {
  if (contest.csf.kind === "ratio" && contest.rivals.every((x) => x.r <= 1)) {
    return { equilibrium: solveConcaveRatio(contest, opts), alternatives: [] };
  }
  return {
    equilibrium: noPureEquilibrium(contest, "unsupported", "This contest type is not solved yet."),
    alternatives: [],
  };
}

/** Ratio form with every r_i <= 1: the pure equilibrium exists and is unique. */
export function solveConcaveRatio(contest: Contest, opts: SolveOptions = {}): Equilibrium {
  const g = opts.gridPoints;
  if (contest.rivals.length === 1) {
    return noPureEquilibrium(
      contest,
      "single-rival",
      "A lone rival wins with any positive effort: the smallest possible step is best, so no effort level is optimal.",
    );
  }
  const sym = identicalRivals(contest) ? symmetricRatioEquilibrium(contest) : null;
  if (sym) return pureEquilibrium(contest, sym, "closed-form:symmetric", g);
  const hr = hillmanRileyEquilibrium(contest);
  if (hr) return pureEquilibrium(contest, hr, "closed-form:hillman-riley", g);
  const nti = ntiTwoRival(contest);
  if (nti) return pureEquilibrium(contest, nti, "closed-form:nti", g);
  const sf = shareFunctionEquilibrium(contest);
  if (sf) {
    const capped = sf.capped.filter(Boolean).length;
    const note =
      capped > 0
        ? `${capped} rival(s) spend their whole budget; the others respond to that (Che & Gale 1997).`
        : undefined;
    return pureEquilibrium(contest, sf.efforts, "share-function", g, note);
  }
  return noPureEquilibrium(
    contest,
    "share-function",
    "At most one rival can spend anything (the others have no budget): that rival wins with any positive step, so no effort level is optimal.",
  );
}
