import { describe, expect, it } from 'vitest';

import { FINISHING_BOARD, FLAT_BOARD, WORKSHOP_BOARD, WORKSHOP_SITE_BOARD } from '@/scripts/demo-data';

// The demo is what a new user checks the tool against first: a board whose drawn main switch
// disagrees with its incoming device in its settings would be one an inspector sends back.
describe('the demo boards agree with themselves', () => {
  const boards = { FLAT_BOARD, WORKSHOP_BOARD, WORKSHOP_SITE_BOARD, FINISHING_BOARD };

  it.each(Object.entries(boards))('%s: its drawn main switch is the rating of its incoming main switch', (_, b) => {
    const drawn = b.ways.filter((w) => w.device.kind === 'main-switch');
    expect(drawn).toHaveLength(1);
    expect(b.settings.incoming.kind).toBe('main-switch');
    expect((drawn[0].device as { ratingA: number }).ratingA).toBe(b.settings.incoming.ratingA);
  });

  it.each(Object.entries(boards))('%s: its main switch has a pole for each line and the neutral', (_, b) => {
    const [main] = b.ways.filter((w) => w.device.kind === 'main-switch');
    expect(main.device.poles).toBe(b.settings.phases === 3 ? 4 : 2);
  });
});
