import { isoInZone } from '../../contracts/dates/club-dates';

export { zonedHeader } from '../../contracts/dates/club-dates';

/**
 * CSV for every export. Cells are quoted for commas, semicolons, quotes and line breaks (RFC 4180), and a cell
 * beginning with =, +, -, @, tab or carriage return (after any spaces) gets a leading single quote (OWASP "CSV
 * Injection"), except a plain negative number such as -12.50, which no spreadsheet reads as a formula.
 *
 * Spreadsheets set to a locale whose list separator is `;` split an unquoted line at every semicolon and ignore
 * quotes that do not start a field, so a formula can also begin right after a `;` inside a cell: that one is
 * neutralised the same way.
 */
export function csvCell(value: unknown): string {
  let s = value === null || value === undefined ? '' : String(value);
  // A plain negative number stays a number; anything else starting with a trigger character is neutralised.
  if (/^ *[=+\-@\t\r]/.test(s) && !/^-\d+(\.\d+)?$/.test(s)) s = `'${s}`;
  s = s.replace(/;( *)(?=[=+\-@\t\r])/g, ";$1'");
  return /[",;\r\n']/.test(s) || s !== s.trim() ? `"${s.replace(/"/g, '""')}"` : s;
}

/** A UTF-8 byte-order mark first, so spreadsheet programs read accents and signs as UTF-8 rather than a legacy code page. */
export const CSV_BOM = '\uFEFF';

/**
 * A whole export: the byte-order mark, the header in words, the rows, CRLF line ends (RFC 4180). Headers of date
 * columns name the zone (`zonedHeader`), cells carry `csvInstant` or a club date, and rows come in date order
 * (`inDateOrder`); statuses are the labels pages show (`contracts/labels`).
 */
export function toCsv(header: string[], rows: unknown[][]): string {
  return CSV_BOM + csvLines([header, ...rows]);
}

/** Rows without mark or header: the later chunks of a streamed export that began with `toCsv(header, [])`. */
export function csvLines(rows: unknown[][]): string {
  return rows.map((r) => r.map(csvCell).join(',') + '\r\n').join('');
}

/** An instant for a CSV cell: ISO 8601 in club time with its offset ("2026-03-08T04:30-05:00"); empty for none. */
export function csvInstant(instant: Date | string | null | undefined, timeZone: string): string {
  return instant ? isoInZone(instant, timeZone) : '';
}

/** Rows oldest first by the instant or `YYYY-MM-DD` date each carries; rows without one go last; ties keep their order. */
export function inDateOrder<T>(rows: readonly T[], dateOf: (row: T) => Date | string | null | undefined): T[] {
  const key = (row: T): number => {
    const d = dateOf(row);
    if (!d) return Number.POSITIVE_INFINITY;
    return typeof d === 'string' ? Date.parse(d.length === 10 ? `${d}T00:00:00Z` : d) : d.getTime();
  };
  return rows
    .map((row, i) => ({ row, i, k: key(row) }))
    .sort((a, b) => a.k - b.k || a.i - b.i)
    .map((x) => x.row);
}

/** Cents as a plain decimal for spreadsheets: -1234 -> "-12.34". */
export function centsToDecimal(cents: number): string {
  const sign = cents < 0 ? '-' : '';
  const abs = Math.abs(cents);
  return `${sign}${Math.floor(abs / 100)}.${String(abs % 100).padStart(2, '0')}`;
}
