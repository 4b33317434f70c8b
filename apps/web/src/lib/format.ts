/**
 * Number formatting for every screen. One fixed locale (en-US grouping) so the server render and
 * the browser render agree and tests are stable. Non-finite input renders as an en dash.
 */

const DASH = "\u2013";

/** Three-letter codes we render as a symbol; anything else is shown as written. */
const SYMBOLS: Record<string, string> = {
  USD: "$",
  EUR: "\u20ac",
  GBP: "\u00a3",
  JPY: "\u00a5",
  CHF: "CHF\u00a0",
  INR: "\u20b9",
};

/** The prefix shown before amounts: "$" stays "$", "EUR" becomes "€", "SEK" becomes "SEK ". */
export function currencyPrefix(currency: string | null | undefined): string {
  const c = (currency ?? "").trim();
  if (c === "") return "";
  const upper = c.toUpperCase();
  if (SYMBOLS[upper] !== undefined) return SYMBOLS[upper];
  if (/^[A-Za-z]{2,}$/.test(c)) return `${c}\u00a0`;
  return c;
}

/** Digits after the decimal point so that a value of this size shows about `significant` digits. */
function decimalsFor(abs: number, significant: number, maxDecimals: number): number {
  if (abs === 0) return 0;
  // For |x| < 1 this goes to zero or below, so leading zeros after the point do not count.
  const intDigits = Math.floor(Math.log10(abs)) + 1;
  return Math.max(0, Math.min(maxDecimals, significant - intDigits));
}

/** Plain number with grouping; `decimals` fixes the digits, otherwise about 4 significant. */
export function formatNumber(value: number, decimals?: number): string {
  if (!Number.isFinite(value)) return DASH;
  const abs = Math.abs(value);
  const d = decimals ?? decimalsFor(abs, 4, 4);
  const text = new Intl.NumberFormat("en-US", {
    minimumFractionDigits: d,
    maximumFractionDigits: d,
  }).format(value);
  // "-0" reads as a bug on screen.
  return text === `-${(0).toFixed(d)}` ? (0).toFixed(d) : text;
}

/** Money: currency prefix, grouping, cents only below 1,000 and when not whole. Negative as "-€12". */
export function formatMoney(value: number, currency?: string | null, decimals?: number): string {
  if (!Number.isFinite(value)) return DASH;
  const abs = Math.abs(value);
  // Cents only where they matter: small amounts that are not whole.
  const d = decimals ?? (abs >= 1000 || Math.abs(abs - Math.round(abs)) < 5e-3 ? 0 : 2);
  const body = formatNumber(abs, d);
  const sign = value < 0 && body !== formatNumber(0, d) ? "-" : "";
  return `${sign}${currencyPrefix(currency)}${body}`;
}

/** Fraction in [0, 1] (or beyond) as a percentage, e.g. 0.4567 -> "45.7%". */
export function formatPercent(fraction: number, decimals = 1): string {
  if (!Number.isFinite(fraction)) return DASH;
  return `${formatNumber(fraction * 100, decimals)}%`;
}

/** Effort in money units, rounded to the effort step's own precision when a step is given. */
export function formatEffort(value: number, currency?: string | null, step?: number): string {
  if (!Number.isFinite(value)) return DASH;
  if (step !== undefined && step > 0) {
    return `${currencyPrefix(currency)}${formatNumber(value, stepDecimals(step))}`;
  }
  return formatMoney(value, currency);
}

/** Decimal places of a step such as 0.25 -> 2, 10 -> 0, 1e-3 -> 3. */
export function stepDecimals(step: number): number {
  if (!Number.isFinite(step) || step <= 0) return 0;
  for (let d = 0; d <= 10; d++) {
    const scaled = step * 10 ** d;
    if (Math.abs(scaled - Math.round(scaled)) < 1e-9 * Math.max(1, scaled)) return d;
  }
  return 10;
}

/** Remaining time as m:ss (or h:mm:ss), never negative. */
export function formatClock(ms: number): string {
  if (!Number.isFinite(ms)) return DASH;
  const total = Math.max(0, Math.ceil(ms / 1000));
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = total % 60;
  const ss = String(s).padStart(2, "0");
  return h > 0 ? `${h}:${String(m).padStart(2, "0")}:${ss}` : `${m}:${ss}`;
}

/** Signed elasticity or derivative, e.g. "+0.25" / "-1.30". */
export function formatSigned(value: number, decimals = 3): string {
  if (!Number.isFinite(value)) return DASH;
  const body = formatNumber(value, decimals);
  if (body.startsWith("-")) return body;
  return Number(body.replace(/,/g, "")) === 0 ? body : `+${body}`;
}

/** Date-time for lists (UTC, so every viewer reads the same text). */
export function formatDateTime(value: string | number | Date): string {
  const d = new Date(value);
  if (Number.isNaN(d.getTime())) return DASH;
  return `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

/** A model parameter as typed: up to `maxDecimals` decimals, trailing zeros dropped (1.25, 1, 0.0002). */
export function formatPlain(value: number, maxDecimals = 6): string {
  if (!Number.isFinite(value)) return DASH;
  return new Intl.NumberFormat("en-US", { maximumFractionDigits: maxDecimals }).format(value);
}
