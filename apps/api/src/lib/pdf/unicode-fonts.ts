import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { openSync, type Font } from 'fontkit';

/**
 * The fonts Femtoslot prints with, all shipped as npm packages (nothing fetched at run time), tried in order for each
 * character:
 * - Manrope (@fontsource/manrope, OFL-1.1), the app's face: its latin, latin-ext, cyrillic(-ext), greek and vietnamese
 *   subsets, so most European names stay in one design;
 * - DejaVu Sans (dejavu-fonts-ttf, Bitstream Vera licence + public-domain changes): wide coverage (Armenian, Georgian,
 *   Hebrew, IPA, symbols) for whatever Manrope lacks;
 * - Noto Sans JP (@embedpdf/fonts-jp, OFL-1.1, OpenType/CFF): kana and the JIS kanji, which also covers most
 *   Chinese characters found in names.
 * pdfkit embeds only the glyphs a document uses (it subsets each face), so a PDF stays small.
 */
export type Weight = 'regular' | 'bold';

export interface FontFace {
  /** pdfkit registration name */
  name: string;
  file: string;
  font: Font;
}

const require = createRequire(import.meta.url);
const packageDir = (entry: string, up: number) => {
  let dir = path.dirname(require.resolve(entry));
  for (let i = 0; i < up; i++) dir = path.dirname(dir);
  return dir;
};

function files(weight: Weight): string[] {
  const manrope = path.join(packageDir('@fontsource/manrope/package.json', 0), 'files');
  const w = weight === 'bold' ? 700 : 400;
  const dejavu = path.join(packageDir('dejavu-fonts-ttf/package.json', 0), 'ttf');
  // @embedpdf/fonts-jp exports only its entry (dist/index.cjs): the fonts folder sits beside dist.
  const noto = path.join(packageDir('@embedpdf/fonts-jp', 1), 'fonts');
  return [
    ...['latin', 'latin-ext', 'cyrillic', 'cyrillic-ext', 'greek', 'vietnamese'].map((s) => path.join(manrope, `manrope-${s}-${w}-normal.woff`)),
    path.join(dejavu, weight === 'bold' ? 'DejaVuSans-Bold.ttf' : 'DejaVuSans.ttf'),
    path.join(noto, weight === 'bold' ? 'NotoSansJP-Bold.otf' : 'NotoSansJP-Regular.otf'),
  ];
}

let cached: Record<Weight, FontFace[]> | null = null;

/** Each weight's chain, opened once per process; a missing file is an install fault, reported by name. */
export function fontChains(): Record<Weight, FontFace[]> {
  if (cached) return cached;
  const chain = (weight: Weight) => files(weight).map((file, i) => {
    if (!existsSync(file)) throw new Error(`PDF font missing: ${file} (run npm ci)`);
    return { name: `fs-${weight}-${i}`, file, font: openSync(file) };
  });
  cached = { regular: chain('regular'), bold: chain('bold') };
  return cached;
}

export interface TextRun {
  face: FontFace;
  text: string;
}

const isSpace = (cp: number) => cp === 0x20 || cp === 0x09 || cp === 0x0a || cp === 0x0d || cp === 0xa0;

/**
 * Splits text into runs of one face each: every character goes to the first face in the chain that has a glyph for
 * it (fontkit's hasGlyphForCodePoint); spaces stay with the run they are in, so words are not cut needlessly. A
 * character no face has goes to DejaVu Sans (the widest), which prints its "missing" box rather than dropping it.
 */
export function splitByCoverage(text: string, chain: FontFace[]): TextRun[] {
  const fallback = chain.find((f) => f.file.includes('DejaVu')) ?? chain[0]!;
  const runs: TextRun[] = [];
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    const last = runs[runs.length - 1];
    const face = isSpace(cp) && last ? last.face : chain.find((f) => f.font.hasGlyphForCodePoint(cp)) ?? fallback;
    if (last && last.face === face) last.text += ch;
    else runs.push({ face, text: ch });
  }
  return runs;
}
