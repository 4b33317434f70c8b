/**
 * Reads a spend-and-share panel from CSV text: header `period,rival,spend,share` in any column
 * order (matched case-insensitively; extra columns ignored), comma, semicolon or tab separated.
 * Spend is a plain number; share a fraction (0.25) or a percentage with % (25%). The CSV itself
 * is parsed by papaparse (quotes, embedded separators and line breaks, byte-order mark), the one
 * CSV reader that both the `contend fit` command and the web Calibrate page use. Pure: text in,
 * rows or the first problem (naming the row and column) out. Row numbers are a spreadsheet's:
 * the header is row 1.
 */
import Papa from "papaparse";
import type { InputError, Parsed } from "../types";
import type { PanelRow } from "./types";

export const PANEL_COLUMNS = ["period", "rival", "spend", "share"] as const;
type Column = (typeof PANEL_COLUMNS)[number];

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

function fail(path: string, message: string): InputError {
  return { ok: false, path, message };
}

function show(text: string): string {
  return JSON.stringify(text.length > 30 ? `${text.slice(0, 30)}...` : text);
}

/** A cell as a number: plain decimal, or (when `percent`) a decimal followed by %. */
function cellNumber(raw: string, at: string, percent: boolean): Parsed<number> {
  const t = raw.trim();
  if (t === "") return fail(at, "is empty");
  const isPercent = percent && t.endsWith("%");
  const body = isPercent ? t.slice(0, -1).trim() : t;
  if (!NUMBER.test(body)) {
    const hint = /\d,\d/.test(body) ? " (write numbers without thousands separators)" : "";
    return fail(at, `is not a number (got ${show(t)})${hint}`);
  }
  const x = Number(body);
  if (!Number.isFinite(x)) return fail(at, `is not a finite number (got ${show(t)})`);
  return { ok: true, value: isPercent ? x / 100 : x };
}

export function parsePanelCsv(text: string): Parsed<PanelRow[]> {
  const parsed = Papa.parse<string[]>(text, {
    skipEmptyLines: false,
    delimitersToGuess: [",", ";", "\t"],
  });
  const quoteError = parsed.errors.find((e) => e.type === "Quotes");
  if (quoteError) {
    const row = quoteError.row === undefined ? "" : `row ${quoteError.row + 1}`;
    return fail(row, `has a quote that is never closed or is misplaced (${quoteError.message})`);
  }
  const lines = parsed.data;
  const blank = (cells: string[]) => cells.every((c) => c.trim() === "");
  const headerAt = lines.findIndex((cells) => !blank(cells));
  if (headerAt < 0)
    return fail("", "the file is empty; the first row must be the header period,rival,spend,share");
  const header = lines[headerAt]!.map((h) =>
    h
      .replace(/^\ufeff/, "")
      .trim()
      .toLowerCase(),
  );
  const col = {} as Record<Column, number>;
  for (const name of PANEL_COLUMNS) {
    const at = header.indexOf(name);
    if (at < 0) {
      return fail(
        `column ${name}`,
        `is missing from the header (need ${PANEL_COLUMNS.join(", ")}; found ${header.map((h) => show(h)).join(", ")})`,
      );
    }
    if (header.indexOf(name, at + 1) >= 0)
      return fail(`column ${name}`, "appears twice in the header");
    col[name] = at;
  }
  const width = Math.max(...Object.values(col)) + 1;
  const rows: PanelRow[] = [];
  for (let k = headerAt + 1; k < lines.length; k++) {
    const cells = lines[k]!;
    if (blank(cells)) continue;
    const rowNo = k + 1;
    if (cells.length < width) {
      const missing = PANEL_COLUMNS.filter((c) => col[c] >= cells.length);
      return fail(
        `row ${rowNo}, column ${missing[0]}`,
        `is missing (the row has ${cells.length} fields)`,
      );
    }
    const spend = cellNumber(cells[col.spend]!, `row ${rowNo}, column spend`, false);
    if (!spend.ok) return spend;
    const share = cellNumber(cells[col.share]!, `row ${rowNo}, column share`, true);
    if (!share.ok) return share;
    rows.push({
      period: cells[col.period]!.trim(),
      rival: cells[col.rival]!.trim(),
      spend: spend.value,
      share: share.value,
      row: rowNo,
    });
  }
  return { ok: true, value: rows };
}

/** Cells (header first) as CSV text, quoting where needed; the inverse of the parsing above. */
export function cellsToCsv(cells: readonly (readonly string[])[]): string {
  return `${Papa.unparse(cells.map((r) => [...r]))}\n`;
}
