import { screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { DerivedSupply } from '@/features/board-editor/components/derived-supply';
import type { DerivedSupply as Derived } from '@/lib/sites/tree-types';

import { json, renderWithQuery } from '../helpers';
import { treeDto } from '../site-tree-dto';

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

const boardOf = (derivedSupply: Derived) => ({
  id: BOARD,
  siteId: SITE,
  siteName: 'Hollin Lane Joinery workshop',
  feed: {
    from: 'way' as const,
    boardId: derivedSupply.fedFrom!.boardId,
    wayId: derivedSupply.fedFrom!.wayId,
    designCurrentOverride: null,
    upstreamRcdTimeDelayed: false,
  },
  derivedSupply,
  supply: { earthing: 'TT' as const, uoV: 230, zeOhm: 21, pfcKa: 0.5, source: 'public' as const },
  version: 4,
  status: 'draft' as const,
  revision: 0,
});

describe('the Supply panel of a fed board', () => {
  it('states the carried values in their units, and a dash for one not carried', async () => {
    // Neither the tree nor the history loads: the board's stored values are shown
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => json({ error: 'The database is not reachable just now.' }, 503)),
    );
    const board = boardOf(derived);
    renderWithQuery(<DerivedSupply board={board} canEdit={false} />);
    const list = screen.getByLabelText('Values carried down to this board (derived)');
    const values = within(list)
      .getAllByRole('definition')
      .map((d) => d.textContent);
    expect(values).toEqual(['0.444 Ω (derived)', '0.99 kA (derived)', '1.23 % (derived)', '– (derived)']);
  });

  it('states the selectivity between the sub-main above and its devices, as the site view does', async () => {
    // The three-level tree of the supply tests: the finishing room board ('fin') is fed from the
    // machine shop board's way with a C20 above its B16 (tests/unit/supply/carried-values.test.ts)
    const tree = treeDto();
    const fin = tree.boards.find((b) => b.boardId === 'fin')!;
    expect(fin.selectivity.length).toBeGreaterThan(0);
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string) =>
        String(url).includes('/tree') ? json({ tree }) : json({ entries: [], nextCursor: null }),
      ),
    );
    renderWithQuery(<DerivedSupply board={{ ...boardOf(derived), id: 'fin' }} canEdit={false} />);
    const summary = await screen.findByText(/^Selectivity below the sub-main \(advisory\):/);
    const panel = screen.getByTestId('derived-supply');
    // Worked in tests/unit/supply/carried-values.test.ts: selective up to 5 × 20 = 100 A
    expect(panel.textContent).toContain('Selective up to 100 A');
    for (const g of fin.selectivity) expect(panel.textContent).toContain(g.working.text);
    expect(summary.closest('details')).not.toBeNull();
  });

  it('states no selectivity for a board the tree has no judgement for', async () => {
    const tree = treeDto();
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string) =>
        String(url).includes('/tree') ? json({ tree }) : json({ entries: [], nextCursor: null }),
      ),
    );
    // The origin's board: nothing above it to judge against
    // An editor's panel: the choice of feed appears once the tree has loaded
    renderWithQuery(<DerivedSupply board={{ ...boardOf(derived), id: 'db1' }} canEdit />);
    await screen.findByRole('combobox');
    expect(screen.getByTestId('derived-supply').textContent).not.toContain('Selectivity');
  });
});
