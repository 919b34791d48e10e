/**
 * CSV (RFC 4180) for the exports (trail, cut records): CRLF line ends, fields quoted when
 * they hold a quote, comma or line break, a byte order mark so spreadsheet apps read UTF-8,
 * and cells that a spreadsheet would run as a formula made inert.
 */

/** Spreadsheet apps run a cell starting with one of these as a formula (CSV injection). */
const FORMULA_START = /^[=+\-@\t\r]/;

export function csvCell(value: string | number | null): string {
  if (value === null) return '';
  let text = String(value);
  if (typeof value === 'string' && FORMULA_START.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvLine(cells: (string | number | null)[]): string {
  return `${cells.map(csvCell).join(',')}\r\n`;
}

/** The byte order mark: spreadsheet apps then read the file as UTF-8 (µ, ø, Ø). */
export const CSV_BOM = '\uFEFF';
