import { describe, expect, it } from 'vitest';

import { boxName, DIAGRAM } from '@/components/site-diagram/layout';

describe('boxName: a board’s name as the diagram’s box shows it', () => {
  it('keeps a name that fits whole', () => {
    expect(boxName('Workshop DB1')).toBe('Workshop DB1');
    const exact = 'x'.repeat(DIAGRAM.nameChars);
    expect(boxName(exact)).toBe(exact);
  });

  it('cuts a longer name at a word near its room, without trailing punctuation, and marks the cut', () => {
    expect(boxName('Main distribution board, east plant room, ground floor', 30)).toBe(
      'Main distribution board, east…',
    );
    expect(boxName('Main distribution board, east plant room', 26)).toBe('Main distribution board…');
    // No word end near the room: cut at the character
    expect(boxName('Supercalifragilisticexpialidocious board', 20)).toBe('Supercalifragilisti…');
    for (const n of [10, 20, 40]) expect(boxName('word '.repeat(30), n).length).toBeLessThanOrEqual(n);
  });
});
