import path from 'node:path';

import { Font } from '@react-pdf/renderer';

/** The family name of the site pack's own pages. */
export const SITE_PACK_FONT = 'BoardwrightSitePack';

let registered = false;

/**
 * Registers the print fonts shipped in public/fonts (DejaVu Sans Condensed: it has Ω, ² and
 * the dashes) under the site pack's own family name, once per process. The schedule feature
 * registers the same files for itself; features do not import each other.
 */
export function registerSitePackFonts(): void {
  if (registered) return;
  const dir = path.join(process.cwd(), 'public', 'fonts');
  Font.register({
    family: SITE_PACK_FONT,
    fonts: [
      { src: path.join(dir, 'DejaVuSansCondensed.ttf'), fontWeight: 400 },
      { src: path.join(dir, 'DejaVuSansCondensed-Bold.ttf'), fontWeight: 700 },
    ],
  });
  registered = true;
}
