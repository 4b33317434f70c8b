/**
 * The solver's dispatcher: picks the right method for the contest and always reports the
 * measured Nash gap of what it returns.
 *   leader set            -> leader-follower (Dixit 1987)
 *   all-pay               -> mixed equilibria (Hillman & Riley 1989; Baye, Kovenock & de Vries 1996)
 *   ratio, every r_i <= 1 -> closed forms where they apply, else the share-function method
 *   ratio with r_i > 1    -> active-set search with global verification
 *   logit                 -> candidate enumeration with global verification
 *   no pure equilibrium   -> two rivals: mixed equilibrium on a refined grid (twoRivalMixed.ts);
 *                            three or more: approximate one by fictitious play (manyRivalMixed.ts)
 * Every result passes reliability.ts: no non-finite number or unverified pure answer leaves.
 */
import { ratioActiveSetSearch, sameProfile } from "./activeSetSearch";
import { allPaySymmetric } from "./allPaySymmetric";
import { allPayTwoRival } from "./allPayTwoRival";
import { hillmanRileyEquilibrium } from "./hillmanRiley";
import { leaderFollowerEquilibrium } from "./leaderFollower";
import { logitSearch } from "./logitSearch";
import { ntiTwoRival } from "./ntiTwoRival";
import { noPureEquilibrium, pureEquilibrium } from "./pureEquilibrium";
import { shareFunctionEquilibrium } from "./shareFunction";
import {
  identicalRivals,
  symmetricExistenceBound,
  symmetricRatioEquilibrium,
} from "./symmetricRatio";
import {
  activeSetEquilibrium,
  activeSetProfile,
  countText,
  symmetricActiveSets,
} from "./symmetricActiveSets";
import { guardSolveResult } from "./reliability";
import { scaledContest, unscaleResult } from "./scaledContest";
import { twoRivalMixedEquilibrium } from "./twoRivalMixed";
import { manyRivalMixedEquilibrium } from "./manyRivalMixed";
import type { Contest, Equilibrium, SolveOptions, SolveResult } from "./types";

export function solve(contest: Contest, opts: SolveOptions = {}): SolveResult {
  const tol = opts.tolerance ?? 1e-6 * contest.prize;
  const scaled = scaledContest(contest);
  const raw = scaled
    ? unscaleResult(
        solveUnguarded(scaled, {
          ...opts,
          ...(opts.tolerance === undefined ? {} : { tolerance: opts.tolerance / contest.prize }),
        }),
        contest.prize,
      )
    : solveUnguarded(contest, opts);
  return guardSolveResult(contest, raw, tol);
}

function solveUnguarded(contest: Contest, opts: SolveOptions): SolveResult {
  if (contest.leader !== null && contest.rivals.length >= 2) {
    return { equilibrium: leaderFollowerEquilibrium(contest, opts.gridPoints), alternatives: [] };
  }
  const csf = contest.csf;
  if (csf.kind === "allpay") return solveAllPay(contest, opts);
  if (csf.kind === "ratio" && contest.rivals.every((x) => x.r <= 1)) {
    return { equilibrium: solveConcaveRatio(contest, opts), alternatives: [] };
  }
  return solveBySearch(contest, opts);
}

/** Exhaustive search over active sets up to this many rivals (2^n candidates). */
const EXHAUSTIVE_UP_TO = 8;

/** Most equilibria listed in one result; more are counted in the note. */
const MAX_LISTED = 50;

/** All-pay auction: mixed equilibria only (no pure one exists with two or more rivals). */
export function solveAllPay(contest: Contest, opts: SolveOptions = {}): SolveResult {
  const g = opts.gridPoints;
  if (contest.rivals.length < 2) {
    return {
      equilibrium: pureEquilibrium(
        contest,
        [0],
        "single-rival",
        g,
        "A lone bidder wins with a zero bid.",
      ),
      alternatives: [],
    };
  }
  const sym = allPaySymmetric(contest, g);
  const two = allPayTwoRival(contest, g);
  if (sym) return { equilibrium: sym, alternatives: two && contest.rivals.length > 2 ? [two] : [] };
  if (two) return { equilibrium: two, alternatives: [] };
  const why = contest.rivals.some((x) => x.weight !== 1)
    ? "weights other than 1 are not supported in the all-pay auction"
    : "a budget cap cuts into the equilibrium bidding range (budget-constrained all-pay auctions are not solved here)";
  return {
    equilibrium: noPureEquilibrium(
      contest,
      "unsupported",
      `The all-pay auction has no pure-strategy equilibrium, and its mixed equilibrium is not computed here: ${why}.`,
    ),
    alternatives: [],
  };
}

/** Ratio form with some r_i > 1, or logit: verified search over candidate profiles. */
export function solveBySearch(contest: Contest, opts: SolveOptions = {}): SolveResult {
  const n = contest.rivals.length;
  const csf = contest.csf;
  const searchOpts = {
    ...(opts.tolerance === undefined ? {} : { tolerance: opts.tolerance }),
    ...(opts.gridPoints === undefined ? {} : { gridPoints: opts.gridPoints }),
  };
  const tol = opts.tolerance ?? 1e-6 * contest.prize;
  const symSets = symmetricActiveSets(contest, tol);
  const found = symSets
    ? symSets.map((set) => ({ efforts: activeSetProfile(n, set), gap: set.gap }))
    : csf.kind === "logit"
      ? logitSearch(contest, searchOpts)
      : ratioActiveSetSearch(contest, searchOpts);
  const method = csf.kind === "logit" ? "numeric:logit-candidates" : "numeric:active-set";
  const notes: string[] = [];
  const first = contest.rivals[0];
  if (csf.kind === "ratio" && first && identicalRivals(contest) && n >= 2) {
    const bound = symmetricExistenceBound(n);
    if (first.r > bound) {
      notes.push(
        `The symmetric profile is not an equilibrium: r = ${first.r} exceeds n/(n-1) = ${bound.toPrecision(4)} (Baye, Kovenock & de Vries 1994).`,
      );
    }
  }
  if (found.length === 0) {
    const maxR = Math.max(...contest.rivals.map((x) => x.r));
    if (csf.kind === "ratio" && maxR > 2) {
      notes.push(
        "With decisiveness above 2 only mixed-strategy equilibria exist (Baye, Kovenock & de Vries 1994); for r >= 2 one of them dissipates the whole prize (Alcalde & Dahm 2010).",
      );
    }
    notes.unshift(
      csf.kind === "ratio"
        ? "No pure-strategy equilibrium found: every candidate set of active rivals failed the global best-response check."
        : "No pure-strategy equilibrium found among the candidate profiles (each rival at zero, at its cap, or at its single interior optimum).",
    );
    const mixed = noPureFallback(contest, opts);
    if (mixed) {
      mixed.note = `${notes.join(" ")} ${mixed.note ?? ""}`.trim();
      return { equilibrium: mixed, alternatives: [] };
    }
    return { equilibrium: noPureEquilibrium(contest, method, notes.join(" ")), alternatives: [] };
  }
  if (found.length > 1) {
    notes.push(
      `${found.length} distinct pure equilibria found${found.length > MAX_LISTED ? ` (the first ${MAX_LISTED} are listed)` : ""}.`,
    );
  }
  if (!symSets && csf.kind === "ratio" && identicalRivals(contest) && n > EXHAUSTIVE_UP_TO) {
    notes.push(
      "The rivals are identical, so any other choice of the same number of active rivals is an equilibrium too (only one of each size is listed).",
    );
  }
  const sym = csf.kind === "ratio" ? symmetricRatioEquilibrium(contest) : null;
  const list = found
    .slice(0, MAX_LISTED)
    .map((f, idx) =>
      symSets && opts.gridPoints === undefined
        ? activeSetEquilibrium(contest, symSets[idx]!)
        : sym && sameProfile(contest, sym, f.efforts)
          ? pureEquilibrium(contest, sym, "closed-form:symmetric", opts.gridPoints)
          : pureEquilibrium(contest, f.efforts, method, opts.gridPoints),
    );
  if (symSets) {
    list.forEach((eq, idx) => {
      const set = symSets[idx]!;
      const count = Math.exp(set.lnCount);
      if (Number.isFinite(count)) eq.equivalents = count < 1e15 ? Math.round(count) : count;
      const more = `${countText(set.lnCount)} equivalent equilibri${count === 1 ? "um" : "a"} with ${set.k} of the ${n} identical rivals active (any ${set.k} of them).`;
      eq.note = eq.note ? `${eq.note} ${more}` : more;
    });
  }
  const [equilibrium, ...alternatives] = list;
  if (notes.length > 0) {
    equilibrium!.note = [...notes, ...(equilibrium!.note ? [equilibrium!.note] : [])].join(" ");
  }
  return { equilibrium: equilibrium!, alternatives };
}

/** Largest certified gap, as a fraction of the prize, of a mixed answer that is reported. */
const MIXED_ACCEPT = 1e-3;

/**
 * The same for three or more rivals: fictitious play converges slowly (about 0.5 % of the
 * prize after 1000 rounds in asymmetric cases), so its approximate answer, flagged and with its
 * certified gap, is shown up to 2 % of the prize, and only while the rivals' possible gains
 * together (n times the gap) stay within a tenth of the prize: beyond that expected totals
 * such as the dissipation mean little.
 */
const MIXED_ACCEPT_MANY = 2e-2;
const MIXED_ACCEPT_MANY_TOTAL = 0.1;

/** Default wall-clock budget of the mixed search with three or more rivals (ms). */
export const MIXED_TIME_BUDGET_MS = 10_000;

/** A mixed equilibrium where one is computed (two rivals exactly, more approximately), else null. */
function noPureFallback(contest: Contest, opts: SolveOptions): Equilibrium | null {
  const n = contest.rivals.length;
  if (n < 2 || opts.mixed === false) return null;
  const clock = opts.now === undefined ? {} : { now: opts.now };
  const eq =
    n === 2
      ? twoRivalMixedEquilibrium(contest, {
          ...(opts.tolerance === undefined ? {} : { tolerance: opts.tolerance }),
          ...clock,
        })
      : manyRivalMixedEquilibrium(contest, {
          ...clock,
          timeBudgetMs: opts.mixedTimeBudgetMs ?? MIXED_TIME_BUDGET_MS,
        });
  if (!eq || eq.kind === "none-pure") return eq;
  const accept = n === 2 ? MIXED_ACCEPT : MIXED_ACCEPT_MANY;
  const gap = eq.nashGap.toPrecision(3);
  if (!(eq.nashGap <= accept * contest.prize)) {
    return noPureEquilibrium(
      contest,
      eq.method,
      `The mixed-strategy search did not get within ${accept * 100}% of the prize (certified Nash gap ${gap}), so no answer is given.`,
    );
  }
  if (n > 2 && !(n * eq.nashGap <= MIXED_ACCEPT_MANY_TOTAL * contest.prize)) {
    return noPureEquilibrium(
      contest,
      eq.method,
      `The mixed-strategy search got a certified Nash gap of ${gap} per rival, but with ${n} rivals their possible gains together exceed ${MIXED_ACCEPT_MANY_TOTAL * 100}% of the prize, so no answer is given.`,
    );
  }
  return eq;
}

/** Ratio form with every r_i <= 1: the pure equilibrium exists and is unique. */
export function solveConcaveRatio(contest: Contest, opts: SolveOptions = {}): Equilibrium {
  const eq = concaveRatioEquilibrium(contest, opts);
  const tol = opts.tolerance ?? 1e-6 * contest.prize;
  if (eq.kind === "pure" && !(eq.nashGap <= tol)) {
    // never expected; said out loud rather than hidden if floating point ever bites
    const warn = `Numerical accuracy warning: the measured Nash gap ${eq.nashGap.toPrecision(3)} exceeds the tolerance ${tol.toPrecision(3)}.`;
    eq.note = eq.note ? `${eq.note} ${warn}` : warn;
  }
  return eq;
}

function concaveRatioEquilibrium(contest: Contest, opts: SolveOptions): Equilibrium {
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
  if (!sf.ok && sf.reason === "not-converged") {
    return noPureEquilibrium(contest, "share-function", `${sf.message}: no equilibrium is shown.`);
  }
  if (sf.ok) {
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
