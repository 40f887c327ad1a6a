import type { z } from 'zod';

import type { boardCreateSchema } from '@/lib/boards/schemas';

/** What the new-board form holds before validation. */
export type BoardCreateValues = z.input<typeof boardCreateSchema>;

/**
 * A new board's starting values: a single-phase board on a public TN-C-S supply at 230 V with
 * Ze 0.35 Ω and 1.5 kA prospective fault current, a 100 A main switch and an 18-module
 * enclosure. These are a starting point the designer overwrites with the site's real figures
 * (Ze and PFC from the supplier or measured); 0.35 Ω is the figure commonly declared for
 * TN-C-S supplies in the UK (common practice, not a limit).
 */
export function newBoardDefaults(siteId = ''): BoardCreateValues {
  return {
    name: '',
    siteId,
    location: '',
    phases: 1,
    supply: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.5, source: 'public' },
    incoming: { kind: 'main-switch', ratingA: 100, busbarRatingA: undefined },
    enclosureModules: 18,
    rails: 1,
    dwelling: false,
  };
}
