import { screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { ReviewSelectivity } from '@/features/review/components/review-selectivity';
import type { SiteTreeDto } from '@/lib/sites/tree-types';

import { json, mockFetch, renderWithQuery } from '../helpers';
import { treeDto } from '../site-tree-dto';

afterEach(() => vi.unstubAllGlobals());

/** The tree with the finishing room board ('fin') given these counts and worst verdict. */
function treeWith(fin: { worst: 'passes' | 'near-limit'; nearLimit: number }): SiteTreeDto {
  const tree = treeDto();
  return {
    ...tree,
    boards: tree.boards.map((b) =>
      b.boardId === 'fin'
        ? {
            ...b,
            worstVerdict: fin.worst,
            sizing: {
              summary: {
                ...b.sizing!.summary,
                counts: { ...b.sizing!.summary.counts, nearLimit: fin.nearLimit, fails: 0 },
              },
            },
          }
        : b,
    ),
  };
}

describe('ReviewSelectivity: the review page states the selectivity below a fed board’s sub-main', () => {
  it('lists each judgement with its working, as the site view does', async () => {
    // The three-level tree of the supply tests: the finishing room board ('fin') is fed from the
    // machine shop board's way with a C20 above its B16 (tests/unit/supply/carried-values.test.ts)
    const tree = treeDto();
    const fin = tree.boards.find((b) => b.boardId === 'fin')!;
    expect(fin.selectivity.length).toBeGreaterThan(0);
    mockFetch(json({ tree }));
    renderWithQuery(<ReviewSelectivity siteId="site-1" boardId="fin" />);
    const summary = await screen.findByText(/^Selectivity below the sub-main \(advisory\):/);
    const shown = screen.getByTestId('review-selectivity').textContent;
    // Worked in tests/unit/supply/carried-values.test.ts: selective up to 5 × 20 = 100 A
    expect(shown).toContain('Selective up to 100 A');
    for (const g of fin.selectivity) expect(shown).toContain(g.working.text);
    expect(summary.closest('details')).not.toBeNull();
  });

  it('says so when the judgements alone make the board near the limit, and not when a way is near it', async () => {
    mockFetch(json({ tree: treeWith({ worst: 'near-limit', nearLimit: 0 }) }));
    const first = renderWithQuery(<ReviewSelectivity siteId="site-1" boardId="fin" />);
    await screen.findByText(/through this selectivity alone \(advisory\); every way passes/);
    first.unmount();
    mockFetch(json({ tree: treeWith({ worst: 'near-limit', nearLimit: 1 }) }));
    renderWithQuery(<ReviewSelectivity siteId="site-1" boardId="fin" />);
    await screen.findByText(/^Selectivity below the sub-main/);
    expect(screen.queryByText(/every way passes/)).toBeNull();
  });

  it('shows nothing for a board with no judgement above it, and the server’s words when the tree cannot be read', async () => {
    mockFetch(json({ tree: treeDto() }));
    // The origin's board: nothing above it to judge against
    const origin = renderWithQuery(<ReviewSelectivity siteId="site-1" boardId="db1" />);
    await vi.waitFor(() => expect(screen.queryByText(/^Reading the selectivity/)).toBeNull());
    expect(origin.container.textContent).toBe('');
    origin.unmount();
    mockFetch(json({ error: 'The database is not reachable just now.' }, 503));
    renderWithQuery(<ReviewSelectivity siteId="site-1" boardId="fin" />);
    await screen.findByText(/could not be read: The database is not reachable just now\./);
  });
});
