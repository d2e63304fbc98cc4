// The little of fontkit (no bundled types) that the icon-font test reads.
declare module 'fontkit' {
  export interface Glyph {
    id: number;
  }
  export interface Font {
    characterSet: number[];
    glyphForCodePoint(codePoint: number): Glyph;
    layout(text: string): { glyphs: Glyph[] };
  }
  export function create(buffer: Buffer): Font;
}
