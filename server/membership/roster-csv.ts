/** Cells beginning with these could run as formulas in a spreadsheet (OWASP, "CSV Injection"). */
const FORMULA_START = /^[=+\-@\t\r]/;

/** One CSV cell: formula starts neutralised with a leading single quote, then quoted per RFC 4180. */
export function csvCell(value: unknown): string {
  let text = value === null || value === undefined ? '' : String(value);
  if (FORMULA_START.test(text)) text = `'${text}`;
  return /[",\r\n']/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Rows of cells as CSV text with CRLF line ends (RFC 4180). */
export function toCsv(header: string[], rows: unknown[][]): string {
  return [header, ...rows].map((r) => r.map(csvCell).join(',')).join('\r\n') + '\r\n';
}
