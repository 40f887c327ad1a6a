import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

import { describe, expect, it } from 'vitest';

import { PRINT_LAYOUT } from '@/features/schedule/print/print-files';

/**
 * The code that draws a stored print (an issued revision's schedule and label strips): a change
 * to any of it may change what a print shows, and then `PRINT_LAYOUT` must be raised so that the
 * files stored for issued revisions are rendered again (features/schedule/print/print-files.ts).
 */
const PRINT_SOURCES = [
  'features/schedule/render-schedule.ts',
  'features/schedule/components/schedule-document.tsx',
  'features/schedule/components/label-strips-document.tsx',
  'features/schedule/utils/build-schedule.ts',
  'features/schedule/utils/build-labels.ts',
  'features/schedule/utils/fit-header.ts',
  'features/schedule/utils/fonts.ts',
  'features/schedule/utils/paginate-schedule.ts',
  'features/schedule/utils/print-palette.ts',
  'features/schedule/utils/qr-code.ts',
];

/** The print code's fingerprint, recorded with the layout it was reviewed at. */
const REVIEWED = { layout: 4, sha256: 'b8c6714dc56437edda36eed8efcbf86b1f2c9b379002401b84c117b441d08848' };

function fingerprint(): string {
  const hash = crypto.createHash('sha256');
  for (const file of PRINT_SOURCES) {
    hash.update(file);
    hash.update(fs.readFileSync(path.join(process.cwd(), file)));
  }
  return hash.digest('hex');
}

describe('PRINT_LAYOUT follows the print code', () => {
  it('the print code is the code reviewed at this PRINT_LAYOUT', () => {
    const now = fingerprint();
    // On a failure: if what a print shows changed, raise PRINT_LAYOUT; either way, record the new
    // fingerprint and the layout here once the change has been looked at as a print
    expect(
      { layout: PRINT_LAYOUT, sha256: now },
      `The print code changed since it was reviewed at layout ${REVIEWED.layout}. If what a printed schedule or label strip shows changed, raise PRINT_LAYOUT in features/schedule/print/print-files.ts; then set REVIEWED in this test to { layout: ${PRINT_LAYOUT}, sha256: '${now}' }.`,
    ).toEqual(REVIEWED);
  });

  it('every file the stored prints are drawn from is in the list', () => {
    // What render-schedule.ts imports from the schedule feature (the web page's own files aside)
    const render = fs.readFileSync(path.join(process.cwd(), 'features/schedule/render-schedule.ts'), 'utf8');
    const imported = [...render.matchAll(/from '\.\/([^']+)'/g)].map((m) => m[1]);
    for (const file of imported.filter((f) => !f.startsWith('print/'))) {
      expect(PRINT_SOURCES.some((s) => s.startsWith(`features/schedule/${file}.`))).toBe(true);
    }
  });
});
