import { describe, expect, it } from 'vitest';

import { clientAddress } from '@/lib/auth/options';

describe('clientAddress (per-address sign-in limit)', () => {
  it('takes the entry the nearest proxy appended, not what the client claimed', () => {
    expect(clientAddress('203.0.113.9, 198.51.100.20')).toBe('198.51.100.20');
    expect(clientAddress('198.51.100.20')).toBe('198.51.100.20');
  });

  it('copes with no header, an array header and junk', () => {
    expect(clientAddress(undefined)).toBe('unknown');
    expect(clientAddress(['203.0.113.9', '198.51.100.7'])).toBe('198.51.100.7');
    expect(clientAddress(' , ')).toBe('unknown');
    expect(clientAddress('x'.repeat(500))).toHaveLength(64);
  });
});
