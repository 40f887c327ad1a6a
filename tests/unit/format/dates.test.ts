import { describe, expect, it } from 'vitest';

import { formatDateTime } from '@/lib/dates';

describe('the one date-and-time format', () => {
  it('writes day, short month, year and 24-hour time', () => {
    // Built from local parts, so the check holds in any time zone the tests run in
    expect(formatDateTime(new Date(2026, 11, 2, 14, 5))).toBe('2 Dec 2026, 14:05');
    expect(formatDateTime(new Date(2025, 2, 1, 9, 0).toISOString())).toBe('1 Mar 2025, 09:00');
  });

  it('gives nothing for what is not a date', () => {
    expect(formatDateTime('not a date')).toBeNull();
    expect(formatDateTime(null)).toBeNull();
    expect(formatDateTime(undefined)).toBeNull();
  });
});
