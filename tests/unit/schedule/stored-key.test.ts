import { describe, expect, it } from 'vitest';

import { PRINT_LAYOUT, storedKey } from '@/features/schedule/print/print-files';

// What an issued revision's print is stored under (features/schedule/print/print-files.ts)
const facts = {
  boardId: 'b1',
  boardUrl: 'http://127.0.0.1:3000/boards/b1',
  revision: 3,
  status: 'issued' as const,
  issued: { at: '2026-12-01T09:00:00.000Z', byName: 'Priya Lund' },
  labels: null,
};
const monday = new Date('2026-11-30T10:00:00Z');
const tuesday = new Date('2026-12-01T10:00:00Z');

describe('storedKey: where an issued print is kept', () => {
  it('is the same file for the same state on the same day, and a new one the next day', () => {
    expect(storedKey('schedule', facts, monday)).toBe(storedKey('schedule', facts, monday));
    expect(storedKey('schedule', facts, tuesday)).not.toBe(storedKey('schedule', facts, monday));
    // Label strips print no date: one file for the revision
    expect(storedKey('labels', facts, tuesday)).toBe(storedKey('labels', facts, monday));
  });

  it('names the print layout, so that a fix to the printed documents is not served from an older file', () => {
    for (const kind of ['schedule', 'labels'] as const) {
      expect(storedKey(kind, facts, monday)).toBe(storedKey(kind, facts, monday, PRINT_LAYOUT));
      expect(storedKey(kind, facts, monday, PRINT_LAYOUT + 1)).not.toBe(storedKey(kind, facts, monday));
      expect(storedKey(kind, facts, monday)).toMatch(/^prints\/b1\/rev-3\//);
    }
  });
});
