/**
 * One CSV row with every field quoted. A cell that a spreadsheet would read as a formula (starting with = + - @,
 * tab or carriage return) gets a leading single quote (OWASP, "CSV Injection").
 */
export function csvRow(cells: readonly (string | number | null | undefined)[]): string {
  return cells
    .map((c) => {
      const s = c === null || c === undefined ? '' : String(c);
      const safe = /^[=+\-@\t\r]/.test(s) ? `'${s}` : s;
      return `"${safe.replace(/"/g, '""')}"`;
    })
    .join(',');
}

/** A whole CSV document with CRLF line ends (RFC 4180). */
export function csvDocument(header: readonly string[], rows: readonly (readonly (string | number | null | undefined)[])[]): string {
  return [header, ...rows].map(csvRow).join('\r\n') + '\r\n';
}
