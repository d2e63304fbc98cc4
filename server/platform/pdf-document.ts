import PDFDocument from 'pdfkit';

/**
 * DejaVu Sans (the dejavu-fonts-ttf package, Bitstream Vera licence): Latin, Greek and Cyrillic with their accents,
 * so a name such as "Łukasz Ørsted-Nguyễn" prints as typed. pdfkit embeds only the glyphs a document uses.
 * pdfkit's built-in Helvetica knows Latin-1 only and cannot read the woff2 fonts the web app ships.
 */
const FONTS = {
  body: require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans.ttf'),
  bold: require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans-Bold.ttf'),
  italic: require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans-Oblique.ttf'),
} as const;

/** The names of the registered fonts: `doc.font('body')`, `'bold'`, `'italic'`. */
export type PdfFont = keyof typeof FONTS;

/** A US Letter document with Padside's fonts registered, and the bytes once `doc.end()` is called. */
export function newPdf(title: string): { doc: PDFKit.PDFDocument; done: Promise<Buffer> } {
  const doc = new PDFDocument({ size: 'LETTER', margin: 56, info: { Title: title, Author: 'Padside' } });
  for (const [name, file] of Object.entries(FONTS)) doc.registerFont(name, file);
  doc.font('body');
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  return { doc, done };
}
