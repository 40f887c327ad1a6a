import { describe, expect, it } from 'vitest';

import { vdLimitText } from '@/lib/names';

describe('vdLimitText: a volt drop limit as a reader sees it', () => {
  it('shows the limits at the origin whole (BS 7671 Appendix 4 Table 4Ab: 3 % lighting, 5 % other uses)', () => {
    expect(vdLimitText(3)).toBe('3');
    expect(vdLimitText(5)).toBe('5');
  });

  it('shows a limit carried down a tree to two decimals, never the float the subtraction leaves', () => {
    // 5 % less what the demo's sub-main to the finishing room uses at its design current
    // (0.80301… %): the schedule printed it as 4.196983453405282 before
    expect(vdLimitText(5 - 0.803016546594718)).toBe('4.20');
    expect(vdLimitText(3 - 0.5)).toBe('2.50');
  });
});
