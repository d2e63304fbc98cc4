/**
 * The browser's first look at a log: the header row and the first rows. The guess at the columns is the server's own
 * (contracts/flights/column-mapping.ts), so the form is prefilled as the server would read the log.
 */

/** The header row and up to `rows` data rows of a CSV text (comma, semicolon or tab separated; `#` comments). */
export function previewRows(text: string, rows = 5): { headers: string[]; rows: string[][] } {
  const lines = text
    .replace(/^\uFEFF/, '')
    .split(/\r\n|\n|\r/)
    .filter((l) => l.trim() !== '' && !l.startsWith('#'));
  if (lines.length === 0) return { headers: [], rows: [] };
  const counts = [',', ';', '\t'].map((d) => [d, lines[0].split(d).length] as const);
  const delimiter = counts.reduce((best, c) => (c[1] > best[1] ? c : best))[0];
  const split = (line: string) => line.split(delimiter).map((cell) => cell.trim().replace(/^"(.*)"$/, '$1'));
  const body = lines.slice(1, rows + 1);
  return { headers: split(lines[0]), rows: body.map(split) };
}

/** The text of a slice of a file (FileReader, which every browser and the test DOM have). */
export function readText(blob: Blob): Promise<string> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(String(reader.result ?? ''));
    reader.onerror = () => reject(reader.error);
    reader.readAsText(blob);
  });
}
