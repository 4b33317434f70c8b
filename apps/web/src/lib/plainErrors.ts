/**
 * Validation messages in plain words that name the field. The rules and their messages live in
 * the solver's validator and the protocol's schemas (one place); this only rewords them for a
 * form: "rivals.1.cost: must be a finite number > 0 (got "")" becomes
 * "Rival 2 cost: enter a number above 0."
 */

const FIELD_NAMES: Record<string, string> = {
  title: "Title",
  prize: "Prize",
  currency: "Currency",
  "csf.decisiveness": "Decisiveness",
  "csf.scale": "Logit scale",
  "csf.kind": "Contest form",
  leader: "Leader",
  rivals: "Rivals",
  fronts: "Fronts",
  "session.effortStep": "Effort step",
  "session.rounds": "Rounds",
  "session.clockSeconds": "Round clock",
  "session.missingMove": "Missing move",
  "session.outcome": "Outcome",
  "session.computer": "Computer players",
  scenario: "Scenario",
};

const RIVAL_FIELDS: Record<string, string> = {
  name: "name",
  cost: "cost",
  value: "value",
  weight: "head start (weight)",
  budget: "budget",
  decisiveness: "own decisiveness",
  sunkBudget: "sunk budget",
};

const FRONT_FIELDS: Record<string, string> = {
  name: "name",
  prize: "prize",
  "csf.decisiveness": "decisiveness",
  "csf.scale": "logit scale",
  "csf.kind": "contest form",
};

/** "rivals.1.cost" -> "Rival 2 cost"; "session.rounds" -> "Rounds"; "fronts.0.prize" -> "Front 1 prize". */
export function fieldName(path: string): string {
  const perFront = /^rivals\.(\d+)\.(cost|value|weight)\.(\d+)$/.exec(path);
  if (perFront) {
    const [i, f, k] = [Number(perFront[1]) + 1, perFront[2]!, Number(perFront[3]) + 1];
    return `Rival ${i} ${RIVAL_FIELDS[f] ?? f} on front ${k}`;
  }
  const front = /^fronts\.(\d+)(?:\.(.+))?$/.exec(path);
  if (front) {
    const k = Number(front[1]) + 1;
    return front[2] ? `Front ${k} ${FRONT_FIELDS[front[2]] ?? front[2]}` : `Front ${k}`;
  }
  const rival = /^rivals\.(\d+)(?:\.(\w+))?$/.exec(path);
  if (rival) {
    const n = Number(rival[1]) + 1;
    return rival[2] ? `Rival ${n} ${RIVAL_FIELDS[rival[2]] ?? rival[2]}` : `Rival ${n}`;
  }
  const hidden = /^session\.hidden\.rivals\.(.+?)\.(cost|value)(?:\.(low|mode|high|dist))?$/.exec(
    path,
  );
  if (hidden) {
    const end = hidden[3] ? `, ${hidden[3] === "mode" ? "most likely" : hidden[3]}` : "";
    return `Private ${hidden[2]} range of ${hidden[1]}${end}`;
  }
  if (path === "session.hidden.truth") return "Truth of the private numbers";
  const computer = /^session\.computer\.(.+?)(?:\.(\w+))?$/.exec(path);
  if (computer) return `Computer player for ${computer[1]}`;
  return FIELD_NAMES[path] ?? path;
}

function bound(op: string, value: string): string {
  const words: Record<string, string> = {
    ">": "above",
    ">=": "at least",
    "<": "below",
    "<=": "at most",
  };
  return `${words[op] ?? op} ${value}`;
}

/** The rule part of a message, reworded; unknown shapes pass through unchanged. */
export function plainRule(message: string): string {
  const typed = /\(got (.*)\)\s*$/.exec(message)?.[1];
  const rest = message.replace(/\s*\(got .*\)\s*$/, "");
  const you =
    typed === undefined || typed === '""' || typed === "undefined" ? "" : ` (you entered ${typed})`;
  if (/non-empty string/.test(rest)) return "cannot be empty.";
  const range =
    /^must be (?:a finite number |a number )?(>=|>|<=|<) (-?[\d.e+]+)(?: and (<=|<) (-?[\d.e+]+))?$/.exec(
      rest,
    );
  if (range) {
    const parts = [bound(range[1]!, range[2]!)];
    if (range[3]) parts.push(bound(range[3], range[4]!));
    const isNumber = typed !== undefined && /^-?[\d.e+]+$/.test(typed);
    const verb = isNumber ? "must be" : "enter a number";
    return `${verb} ${parts.join(" and ")}${you}.`;
  }
  if (/must be an integer/.test(rest)) return `enter a whole number${you}.`;
  const text = rest.replace(/^must /, "must ");
  return `${text}${you}.`;
}

/** One message for one field: "Rival 2 cost: enter a number above 0." */
export function plainError(path: string, message: string): string {
  const withoutPath = message.startsWith(`${path}: `) ? message.slice(path.length + 2) : message;
  return `${fieldName(path)}: ${plainRule(withoutPath)}`;
}

/** Every field's message reworded, keyed as before. */
export function plainErrors(errors: Record<string, string>): Record<string, string> {
  return Object.fromEntries(Object.entries(errors).map(([p, m]) => [p, plainError(p, m)]));
}
