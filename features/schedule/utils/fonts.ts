import path from 'node:path';

import { Font } from '@react-pdf/renderer';

import { installPdfkitFontReuse } from '@/lib/pdf/pdfkit-font-reuse';

/** The family name the printed documents use. */
export const PRINT_FONT = 'BoardwrightPrint';

let registered = false;

/**
 * Registers the fonts shipped in public/fonts with react-pdf, once per process, and has pdfkit
 * select a font it has opened already without opening it again (lib/pdf/pdfkit-font-reuse.ts).
 * DejaVu Sans Condensed (a free licence, see public/fonts/DejaVu-LICENSE.txt) is used because
 * react-pdf needs static TTF or WOFF files and the app's Inter is only installed as a variable
 * WOFF2; its narrow width also suits a schedule of thirteen columns. It has Ω, ², ✓ and ✗.
 */
export function registerPrintFonts(): void {
  if (registered) return;
  const dir = path.join(process.cwd(), 'public', 'fonts');
  Font.register({
    family: PRINT_FONT,
    fonts: [
      { src: path.join(dir, 'DejaVuSansCondensed.ttf'), fontWeight: 400 },
      { src: path.join(dir, 'DejaVuSansCondensed-Bold.ttf'), fontWeight: 700 },
    ],
  });
  // Way references and cable sizes must never be split across lines with a hyphen.
  Font.registerHyphenationCallback((word) => [word]);
  installPdfkitFontReuse();
  registered = true;
}

/** Width of a text in the print font, points. */
export type TextMeasure = (text: string, fontSize: number, bold?: boolean) => number;

type GlyphSource = { unitsPerEm: number; glyphForCodePoint: (cp: number) => { advanceWidth: number } };

let measureCache: TextMeasure | null = null;

/**
 * Measures text with the print font's own advance widths, so that pages can be laid out
 * before react-pdf renders them. Loads the font files once per process.
 */
export async function printFontMeasure(): Promise<TextMeasure> {
  if (measureCache) return measureCache;
  registerPrintFonts();
  const faces = await Promise.all(
    [400, 700].map(async (fontWeight) => {
      const source = Font.getFont({ fontFamily: PRINT_FONT, fontWeight });
      await source.load();
      return source.data as unknown as GlyphSource;
    }),
  );
  const widths = faces.map(() => new Map<number, number>());
  measureCache = (text, fontSize, bold = false) => {
    const i = bold ? 1 : 0;
    let em = 0;
    for (const ch of text) {
      const cp = ch.codePointAt(0)!;
      let w = widths[i].get(cp);
      if (w === undefined) {
        w = faces[i].glyphForCodePoint(cp).advanceWidth / faces[i].unitsPerEm;
        widths[i].set(cp, w);
      }
      em += w;
    }
    return em * fontSize;
  };
  return measureCache;
}
