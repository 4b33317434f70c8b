/**
 * One number format for every screen, chart, table and export view. Rules:
 * - about four significant digits, never fewer digits than the whole part (123,457 not 123,500),
 *   and no trailing zeros ("260", not "260.0"; "65", not "65.00");
 * - money at most to the cent (2 decimals), with the session's currency: an ISO code goes
 *   through Intl.NumberFormat's currency style ("EUR" -> "€", "SEK" -> "SEK 12"), any other text
 *   ("€k", "$") is written before the number as given;
 * - one fixed locale (en-US grouping) so the server render and the browser render agree;
 * - non-finite input renders as an en dash; "-0" never appears.
 */

const DASH = "\u2013";
const LOCALE = "en-US";
/** The significant digits every screen shows. */
export const SIGNIFICANT_DIGITS = 4;
/** Money is never shown below the cent. */
const MONEY_DECIMALS = 2;

/** Digits after the point so that a value of this size shows `significant` digits, within [0, max]. */
function decimalsFor(abs: number, significant: number, maxDecimals: number): number {
  if (abs === 0 || !Number.isFinite(abs)) return 0;
  const intDigits = Math.floor(Math.log10(abs)) + 1;
  return Math.max(0, Math.min(maxDecimals, significant - intDigits));
}

const cache = new Map<string, Intl.NumberFormat>();
function numberFormat(options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = JSON.stringify(options);
  let f = cache.get(key);
  if (!f) {
    f = new Intl.NumberFormat(LOCALE, { signDisplay: "negative", ...options });
    cache.set(key, f);
  }
  return f;
}

/** A three-letter code Intl knows as a currency, else null. */
function isoCurrency(currency: string | null | undefined): string | null {
  const c = (currency ?? "").trim().toUpperCase();
  if (!/^[A-Z]{3}$/.test(c)) return null;
  try {
    numberFormat({ style: "currency", currency: c });
    return c;
  } catch {
    return null;
  }
}

/** The text shown before amounts: "EUR" -> "€", "SEK" -> "SEK ", "€k" and "$" as written. */
export function currencyPrefix(currency: string | null | undefined): string {
  const iso = isoCurrency(currency);
  if (iso) {
    const parts = numberFormat({ style: "currency", currency: iso, maximumFractionDigits: 0 })
      .formatToParts(1)
      .filter((p) => p.type === "currency" || p.type === "literal");
    return parts.map((p) => p.value).join("");
  }
  return (currency ?? "").trim();
}

/**
 * Plain number in the one format; `decimals` fixes the digits after the point (for counts such
 * as milliseconds), otherwise about four significant digits and no trailing zeros.
 */
export function formatNumber(value: number, decimals?: number): string {
  if (!Number.isFinite(value)) return DASH;
  const d = decimals ?? decimalsFor(Math.abs(value), SIGNIFICANT_DIGITS, 20);
  return numberFormat({
    minimumFractionDigits: decimals === undefined ? 0 : d,
    maximumFractionDigits: d,
  }).format(value);
}

/**
 * A short number for crowded chart axes: thousands and millions abbreviated ("45K", "1.2M"),
 * at most four significant digits.
 */
export function formatCompact(value: number): string {
  if (!Number.isFinite(value)) return DASH;
  return numberFormat({ notation: "compact", maximumSignificantDigits: SIGNIFICANT_DIGITS }).format(
    value,
  );
}

/** Money in the session's currency: about four significant digits, at most to the cent. */
export function formatMoney(value: number, currency?: string | null, decimals?: number): string {
  if (!Number.isFinite(value)) return DASH;
  const d = decimals ?? decimalsFor(Math.abs(value), SIGNIFICANT_DIGITS, MONEY_DECIMALS);
  const digits = {
    minimumFractionDigits: decimals === undefined ? 0 : d,
    maximumFractionDigits: d,
  };
  const iso = isoCurrency(currency);
  if (iso) return numberFormat({ style: "currency", currency: iso, ...digits }).format(value);
  const body = numberFormat(digits).format(Math.abs(value));
  const zero = numberFormat(digits).format(0);
  const sign = value < 0 && body !== zero ? "-" : "";
  return `${sign}${currencyPrefix(currency)}${body}`;
}

/** Money per unit of effort (a cost): "€k1.2 per unit of effort". */
export function formatCost(value: number, currency?: string | null): string {
  return `${formatMoney(value, currency)} per unit of effort`;
}

/** Fraction in [0, 1] (or beyond) as a percentage with three significant digits: 45.7%, 100%. */
export function formatPercent(fraction: number): string {
  if (!Number.isFinite(fraction)) return DASH;
  const pct = fraction * 100;
  const d = decimalsFor(Math.abs(pct), 3, 2);
  return `${numberFormat({ minimumFractionDigits: 0, maximumFractionDigits: d }).format(pct)}%`;
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

/** Signed elasticity or derivative, e.g. "+0.25" / "-1.3", in the one format. */
export function formatSigned(value: number, decimals?: number): string {
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
  return numberFormat({ maximumFractionDigits: maxDecimals }).format(value);
}
