// fontkit (pdfkit's font engine) ships no types; only what Femtoslot calls.
declare module 'fontkit' {
  export interface Font {
    postscriptName: string;
    hasGlyphForCodePoint(codePoint: number): boolean;
  }
  export function openSync(path: string): Font;
}
