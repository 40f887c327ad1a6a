import PDFDocument from 'pdfkit';

/**
 * pdfkit 0.20 (under react-pdf 4.9) opens a font again on every `doc.font(font)` call whose
 * source is a font object rather than a name, and only then finds that it has it already
 * (`isEqualFont`, which compares the fonts' name tables through JSON.stringify). react-pdf calls
 * `doc.font(font, size)` with the font object for every run of text (130 times for the print
 * warm-up's board of five ways), which was about a tenth of a render's CPU in the print
 * thread's profile. This keeps, per document, the font pdfkit opened for each font object, and
 * selects it again as pdfkit's own cache hit would (source, family and size set, that font
 * current). The pages draw the same with the same fonts; only pdfkit's font numbers (/F3 where
 * it said /F13) and the subset tags made from them differ. Installed once a process by
 * `registerPrintFonts` (features/schedule/utils/fonts.ts); the test renders each kind of PDF
 * with and without it and compares what the pages draw (tests/unit/schedule).
 */

type FontSelecting = {
  _font: unknown;
  _fontSource: unknown;
  _fontFamily: unknown;
  fontSize(size: unknown): unknown;
  font(src: unknown, family?: unknown, size?: unknown): unknown;
};

const prototype = (PDFDocument as unknown as { prototype: FontSelecting }).prototype;
const pdfkitFont = prototype.font;

/** Each document's fonts as pdfkit opened them, by the font object react-pdf passed. */
const openedByDocument = new WeakMap<object, WeakMap<object, unknown>>();

/** How many selections were answered from a document's own fonts (for the test). */
let reused = 0;

function font(this: FontSelecting, src: unknown, family?: unknown, size?: unknown) {
  if (typeof src !== 'object' || src === null) return pdfkitFont.call(this, src, family, size);
  const opened = openedByDocument.get(this)?.get(src);
  if (opened === undefined) {
    const out = pdfkitFont.call(this, src, family, size);
    if (!openedByDocument.has(this)) openedByDocument.set(this, new WeakMap());
    openedByDocument.get(this)!.set(src, this._font);
    return out;
  }
  // What pdfkit's font() does when its cache has the font (a size may come second)
  if (typeof family === 'number') [size, family] = [family, null];
  this._fontSource = src;
  this._fontFamily = family;
  if (size != null) this.fontSize(size);
  this._font = opened;
  reused += 1;
  return this;
}

/** Selects a font object already opened in a document without opening it again. */
export function installPdfkitFontReuse(): void {
  prototype.font = font;
}

/** pdfkit's own font() again (a test compares the two). */
export function uninstallPdfkitFontReuse(): void {
  prototype.font = pdfkitFont;
}

/** Selections answered without opening the font again, since the process started. */
export function pdfkitFontReuses(): number {
  return reused;
}
