import { execFileSync } from 'node:child_process';

// pdfjs-dist ships only ES modules, which this CommonJS test runner cannot load, so a child node reads the PDF.
const SCRIPT = `
const { getDocument } = await import('pdfjs-dist/legacy/build/pdf.mjs');
const chunks = [];
for await (const c of process.stdin) chunks.push(c);
const pdf = await getDocument({ data: new Uint8Array(Buffer.concat(chunks)), verbosity: 0 }).promise;
const pages = [];
for (let n = 1; n <= pdf.numPages; n++) {
  const content = await (await pdf.getPage(n)).getTextContent();
  pages.push(content.items.map((i) => i.str + (i.hasEOL ? '\\n' : '')).join(''));
}
process.stdout.write(JSON.stringify(pages));
`;

/** The text of each page of a PDF as a PDF reader extracts it (pdfjs-dist, the engine of Firefox's reader). */
export function pdfPages(pdf: Buffer): string[] {
  return JSON.parse(
    execFileSync(process.execPath, ['--input-type=module', '-e', SCRIPT], {
      input: pdf,
      cwd: __dirname,
      encoding: 'utf8',
      maxBuffer: 16 * 1024 * 1024,
    }),
  ) as string[];
}

/** All of a PDF's text, pages joined by a blank line. */
export const pdfText = (pdf: Buffer): string => pdfPages(pdf).join('\n\n');
