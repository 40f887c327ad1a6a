import { screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { DerivedSupply } from '@/features/board-editor/components/derived-supply';
import type { DerivedSupply as Derived } from '@/lib/sites/tree-types';

import { json, renderWithQuery } from '../helpers';

// A fed board's Supply panel states each value carried down to it in its unit, greyed as
// derived, with a dash for a value the tree could not carry.

afterEach(() => {
  vi.unstubAllGlobals();
});

const SITE = '11111111-1111-4111-8111-111111111111';
const BOARD = 'cccccccc-cccc-4ccc-8ccc-cccccccccccc';
const working = { text: 'Worked out for the test.', steps: [], sources: [] };

const derived: Derived = {
  from: 'way',
  supply: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.4437, pfcKa: 0.987, source: 'public', vdUsedPct: 1.234 },
  fedFrom: {
    boardId: 'dddddddd-dddd-4ddd-8ddd-dddddddddddd',
    boardName: 'Workshop DB1',
    wayId: 'w10',
    wayLabel: '10',
    device: 'MCB C32',
    cable: '10 mm² armoured thermosetting, 25 m',
  },
  phase: null,
  zdb: { value: 0.4437, working },
  pfc: { value: 0.987, working, shortCircuitKa: 0.987, earthFaultKa: 0.52 },
  vdUsed: { value: 1.234, working },
  subMainCurrent: null,
  problem: null,
  treeVersion: 3,
};

describe('the Supply panel of a fed board', () => {
  it('states the carried values in their units, and a dash for one not carried', async () => {
    // Neither the tree nor the history loads: the board's stored values are shown
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => json({ error: 'The database is not reachable just now.' }, 503)),
    );
    const board = {
      id: BOARD,
      siteId: SITE,
      siteName: 'Hollin Lane Joinery workshop',
      feed: {
        from: 'way' as const,
        boardId: derived.fedFrom!.boardId,
        wayId: 'w10',
        designCurrentOverride: null,
        upstreamRcdTimeDelayed: false,
      },
      derivedSupply: derived,
      supply: { earthing: 'TT' as const, uoV: 230, zeOhm: 21, pfcKa: 0.5, source: 'public' as const },
      version: 4,
      status: 'draft' as const,
      revision: 0,
    };
    renderWithQuery(<DerivedSupply board={board} canEdit={false} />);
    const list = screen.getByLabelText('Values carried down to this board (derived)');
    const values = within(list)
      .getAllByRole('definition')
      .map((d) => d.textContent);
    expect(values).toEqual(['0.444 Ω (derived)', '0.99 kA (derived)', '1.23 % (derived)', '– (derived)']);
  });
});
