/**
 * The `contend` command line. `main` never touches process globals: it gets argv and an io
 * object, builds the whole output first and returns the exit status (0 ok, 2 bad input,
 * 1 internal error), so a failed run prints one line on stderr and nothing on stdout.
 */
import { normalize } from "../normalize";
import type { InputError, Parsed, Scenario } from "../types";
import { validateScenario } from "../validate";
import { isFrontsInput } from "../fronts/validateFronts";
import { parseArgs, type ParsedArgs } from "./args";
import { runFronts } from "./frontsCommand";
import { parseMoves, runRespond } from "./respondCommand";
import { runSolve } from "./solveCommand";
import { OUT_OF_RANGE } from "../reliability";
import { runStatics } from "./staticsCommand";
import { runSweep } from "./sweepCommand";
import { validateUncertainScenario } from "../uncertain";
import { runUncertainCommand } from "./uncertainCommand";
import { runFit } from "./fitCommand";

export interface CliIo {
  stdout: { write(text: string): unknown };
  stderr: { write(text: string): unknown };
  readFile(path: string): Promise<string>;
}

export const EXIT = { ok: 0, internal: 1, badInput: 2 } as const;

export const HELP = `contend: equilibrium effort in contests (rivals spend costly effort to win one prize)

Usage:
  contend solve FILE [--json]
      Nash equilibrium (or leader-follower outcome) with efforts, shares, payoffs,
      total effort, dissipation and the measured Nash gap; every equilibrium found.
  contend respond FILE --spends S1,S2,... [--json]
      Each rival's best reply and regret against the given spends (money, one per rival);
      --efforts E1,E2,... gives the moves in effort units (effort = spend / cost) instead.
  contend sweep FILE --param PATH --from A --to B --steps N [--json]
      Solve along a line of one parameter; CSV (default) or JSON series.
      PATH: prize | csf.decisiveness | csf.scale | rivals.<i>.<cost|value|weight|budget|decisiveness>
      (rival index i counts from 0 in file order; N points include both ends).
  contend statics FILE [--json]
      Derivatives and elasticities of equilibrium efforts with respect to each parameter.
  contend uncertain FILE [--draws N] [--seed S] [--plan RIVAL] [--json]
      Monte Carlo of the equilibrium when numbers are ranges: P10/P50/P90 of spend, share and
      payoff per rival, drop-out odds, a tornado of payoff swings, and with --plan the spend
      that holds up best for that rival. Ranges go where a number would:
      {"dist":"uniform","low":A,"high":B} or {"dist":"triangular","low":A,"mode":M,"high":B}
      for prize and any rival's cost, value, weight, budget. Defaults: 10000 draws, seed 1.
  contend fit DATA.csv [--seed N] [--resamples N] [--json]
      Calibrate a ratio contest from past spends and shares (CSV columns period, rival,
      spend, share; share as a fraction or with %): decisiveness and head starts with 95%
      intervals, revealed values with bootstrap 90% intervals, fit quality, and a scenario.
  contend --help

FILE is a scenario in JSON: {"title", "prize", "csf": {"kind": "ratio"|"logit"|"allpay", ...},
"rivals": [{"name", "cost", "value"?, "weight"?, "budget"?, "decisiveness"?}], "leader"?, "currency"?}.
A budget is money: the most a rival may spend, cost x effort <= budget.

Several fronts, one budget: give "fronts": [{"name", "prize", "csf"}, ...] instead of "prize" and
"csf"; a rival's cost, value and weight may then be one number or an array with one entry per
front, "budget" is its total money over all fronts and "sunkBudget": true marks money that is
spent here or not at all. solve prints allocations, spends, shares and shadow prices per front;
  contend respond FILE --allocations "a1,a2,...;b1,b2,..." [--json]
takes one row of efforts per rival (one number per front); --spends takes the same rows in money.

Exit status: 0 success, 2 bad input (one line on stderr names the field), 1 internal error.
A stylised model to aid thinking: not a forecast, not financial or legal advice.
`;

type Command = "solve" | "respond" | "sweep" | "statics" | "uncertain" | "fit";

const OPTIONS: Record<Command, { valued: string[]; booleans: string[] }> = {
  solve: { valued: [], booleans: ["json", "help"] },
  respond: { valued: ["spends", "efforts", "allocations"], booleans: ["json", "help"] },
  sweep: { valued: ["param", "from", "to", "steps"], booleans: ["json", "help"] },
  statics: { valued: [], booleans: ["json", "help"] },
  uncertain: { valued: ["draws", "seed", "plan"], booleans: ["json", "help"] },
  fit: { valued: ["seed", "resamples"], booleans: ["json", "help"] },
};

function isCommand(x: string): x is Command {
  return x in OPTIONS;
}

function errorLine(e: InputError, file?: string): string {
  const where = [file, e.path].filter((x) => x !== undefined && x !== "").join(": ");
  return `contend: ${where ? `${where}: ` : ""}${e.message}`.replace(/\s*\n\s*/g, " ");
}

async function readText(file: string, io: CliIo, what: string): Promise<Parsed<string>> {
  try {
    return { ok: true, value: await io.readFile(file) };
  } catch (err) {
    const code = (err as { code?: string }).code;
    const why =
      code === "ENOENT"
        ? "no such file"
        : code === "EISDIR"
          ? "is a directory"
          : (code ?? "unreadable");
    return { ok: false, path: "", message: `cannot read ${what} (${why})` };
  }
}

async function loadScenario<T = Scenario>(
  file: string,
  io: CliIo,
  validate: (json: unknown) => Parsed<T> = validateScenario as (json: unknown) => Parsed<T>,
): Promise<Parsed<T>> {
  const read = await readText(file, io, "scenario file");
  if (!read.ok) return read;
  const text = read.value;
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (err) {
    return { ok: false, path: "", message: `not valid JSON (${(err as Error).message})` };
  }
  return validate(json);
}

async function run(
  command: Command,
  args: ParsedArgs,
  io: CliIo,
): Promise<{ code: number; out: string; err: string }> {
  const bad = (e: InputError, file?: string) => ({
    code: EXIT.badInput,
    out: "",
    err: `${errorLine(e, file)}\n`,
  });
  // exit 2 rather than print a number the solver cannot vouch for (reliability.ts)
  const answer = (res: { ok: true; value: string } | { ok: false; outOfRange: string }) =>
    res.ok
      ? { code: EXIT.ok, out: res.value, err: "" }
      : { code: EXIT.badInput, out: "", err: `${OUT_OF_RANGE}: ${res.outOfRange}\n` };
  const [file, ...extra] = args.positionals;
  if (file === undefined)
    return bad({
      ok: false,
      path: "FILE",
      message: `${command} needs a ${command === "fit" ? "data" : "scenario"} file`,
    });
  if (extra.length > 0) {
    return bad({
      ok: false,
      path: extra[0]!,
      message: `unexpected argument (${command} takes one FILE)`,
    });
  }
  if (command === "fit") {
    const text = await readText(file, io, "data file");
    if (!text.ok) return bad(text, file);
    const source = file.split(/[\\/]/).pop() ?? file;
    const res = runFit(text.value, source, args, args.booleans.has("json"));
    if (res.ok) return { code: EXIT.ok, out: res.value, err: "" };
    return bad(res, res.path.startsWith("--") ? undefined : file);
  }
  if (command === "uncertain") {
    const u = await loadScenario(file, io, validateUncertainScenario);
    if (!u.ok) return bad(u, file);
    const res = runUncertainCommand(u.value, args, args.booleans.has("json"));
    return res.ok ? { code: EXIT.ok, out: res.value, err: "" } : bad(res);
  }
  const raw = await loadScenario<unknown>(file, io, (json) => ({ ok: true, value: json }));
  if (!raw.ok) return bad(raw, file);
  if (isFrontsInput(raw.value)) {
    const res = runFronts(command, raw.value, args);
    if (res.ok) return { code: EXIT.ok, out: res.value, err: "" };
    return bad(res, res.path.startsWith("--") ? undefined : file);
  }
  if (args.flags.has("allocations")) {
    return bad({ ok: false, path: "--allocations", message: "is for scenarios with fronts" });
  }
  const scenario = validateScenario(raw.value);
  if (!scenario.ok) return bad(scenario, file);
  const json = args.booleans.has("json");
  const contest = normalize(scenario.value);
  switch (command) {
    case "solve":
      return answer(runSolve(scenario.value, contest, json));
    case "respond": {
      const spendsRaw = args.flags.get("spends");
      const effortsRaw = args.flags.get("efforts");
      if ((spendsRaw === undefined) === (effortsRaw === undefined))
        return bad({
          ok: false,
          path: spendsRaw === undefined ? "--spends" : "--efforts",
          message:
            spendsRaw === undefined
              ? "is required for respond (or --efforts)"
              : "give --spends or --efforts, not both",
        });
      const efforts =
        spendsRaw !== undefined
          ? parseMoves(spendsRaw, contest, "spends")
          : parseMoves(effortsRaw!, contest, "efforts");
      if (!efforts.ok) return bad(efforts);
      return answer(runRespond(scenario.value, contest, efforts.value, json));
    }
    case "sweep": {
      const res = runSweep(scenario.value, args, json);
      return res.ok ? { code: EXIT.ok, out: res.value, err: "" } : bad(res);
    }
    case "statics": {
      const res = runStatics(scenario.value, json);
      return res.ok ? { code: EXIT.ok, out: res.value, err: "" } : bad(res, file);
    }
  }
}

export async function main(argv: readonly string[], io: CliIo): Promise<number> {
  const [first, ...rest] = argv;
  if (first === undefined) {
    io.stderr.write(
      "contend: missing command (solve, respond, sweep, statics, uncertain, fit); see contend --help\n",
    );
    return EXIT.badInput;
  }
  if (first === "--help" || first === "-h" || first === "help") {
    io.stdout.write(HELP);
    return EXIT.ok;
  }
  if (!isCommand(first)) {
    io.stderr.write(
      `contend: unknown command "${first}" (use solve, respond, sweep, statics, uncertain or fit; see contend --help)\n`,
    );
    return EXIT.badInput;
  }
  const args = parseArgs(rest, OPTIONS[first].valued, OPTIONS[first].booleans);
  if (!args.ok) {
    io.stderr.write(`${errorLine(args)}\n`);
    return EXIT.badInput;
  }
  if (args.value.booleans.has("help")) {
    io.stdout.write(HELP);
    return EXIT.ok;
  }
  try {
    const res = await run(first, args.value, io);
    if (res.out) io.stdout.write(res.out);
    if (res.err) io.stderr.write(res.err);
    return res.code;
  } catch (err) {
    io.stderr.write(
      `contend: internal error: ${(err as Error).message ?? String(err)}\n`.replace(
        /\n(?!$)/g,
        " ",
      ),
    );
    return EXIT.internal;
  }
}
