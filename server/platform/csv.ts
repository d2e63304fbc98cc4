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

/** Rows to CSV text with CRLF line ends (RFC 4180). */
export function toCsv(header: string[], rows: unknown[][]): string {
  return [header, ...rows].map((r) => r.map(csvCell).join(',')).join('\r\n') + '\r\n';
}

/** Cents as a plain decimal for spreadsheets: -1234 -> "-12.34". */
export function centsToDecimal(cents: number): string {
  const sign = cents < 0 ? '-' : '';
  const abs = Math.abs(cents);
  return `${sign}${Math.floor(abs / 100)}.${String(abs % 100).padStart(2, '0')}`;
}
