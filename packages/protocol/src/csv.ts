/**
 * RFC 4180 CSV: comma separated, CRLF line ends, fields quoted when they hold a comma, quote
 * or line break. Numbers are written with full precision so a spreadsheet gets the stored
 * value; a text field starting with = + - @ is prefixed with ' so spreadsheets do not run it
 * as a formula (common practice, no source). One writer for every CSV the app makes: the
 * server's session export and the web's cohort file of compared sessions.
 */
export type CsvCell = string | number | boolean | null;

export function toCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return [header, ...rows].map((row) => row.map(cell).join(",")).join("\r\n") + "\r\n";
}

function cell(value: CsvCell): string {
  if (value === null) return "";
  if (typeof value === "number") return Number.isFinite(value) ? String(value) : "";
  if (typeof value === "boolean") return value ? "true" : "false";
  const text = /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}
