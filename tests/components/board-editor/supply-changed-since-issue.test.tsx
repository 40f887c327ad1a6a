import { screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { DerivedSupply } from '@/features/board-editor/components/derived-supply';
import type { AuditEntry } from '@/lib/audit-types';
import type { BoardDto } from '@/lib/boards/schemas';
import type { DerivedSupply as Derived } from '@/lib/sites/tree-types';

import { json, renderWithQuery } from '../helpers';

// An issued board whose supply changed upstream after it was issued keeps its status (nobody
// changed it; the issued revision is a fixed record), but the editor says that the supply
// changed since issue, so the designer can start the next revision.

afterEach(() => {
  vi.unstubAllGlobals();
});

const SITE = '11111111-1111-4111-8111-111111111111';
const BOARD = 'bbbbbbbb-bbbb-4bbb-8bbb-bbbbbbbbbbbb';

const derived: Derived = {
  from: 'origin',
  supply: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.5, source: 'public' },
  fedFrom: null,
  phase: null,
  zdb: null,
  pfc: null,
  vdUsed: null,
  subMainCurrent: null,
  problem: null,
  treeVersion: 4,
};

function board(status: BoardDto['status'], revision = 2) {
  return {
    id: BOARD,
    siteId: SITE,
    siteName: 'Hollin Lane Joinery workshop',
    feed: { from: 'origin' as const },
    derivedSupply: derived,
    supply: derived.supply,
    version: 9,
    status,
    revision,
  };
}

const entry = (action: string, createdAt: string, details: Record<string, unknown> = {}): AuditEntry => ({
  id: `${action}-${createdAt}`,
  action,
  details,
  userName: 'Dee Signer',
  createdAt,
  wayLabel: null,
});
const supplyChanged = entry('board.supply-changed', '2026-11-20T10:00:00.000Z', {
  cause: 'The site’s origin was changed',
  supplyChanged: true,
  ways: [{ wayId: 'w3', way: 'Way 3', before: 'passes', after: 'near-limit' }],
});
const approved = entry('review.approved', '2026-11-10T10:00:00.000Z', { revision: 2 });

/** Answers the tree (not loaded: the board's stored values are used) and the board's history. */
function serve(entries: AuditEntry[]) {
  const fn = vi.fn(async (url: string | URL | Request) => {
    const u = String(url);
    if (u.includes('/audit')) return json({ entries, nextBefore: null });
    return json({ error: 'The database is not reachable just now.' }, 503);
  });
  vi.stubGlobal('fetch', fn);
  return fn;
}

describe('the Supply panel of an issued board', () => {
  it('says the supply changed since issue when the change is newer than the approval', async () => {
    const fetch = serve([supplyChanged, approved]);
    renderWithQuery(<DerivedSupply board={board('issued')} canEdit />);
    const note = await screen.findByTestId('supply-changed-since-issue');
    expect(note.textContent).toBe(
      'Supply changed since issue. The site’s origin was changed after revision 2 was issued, so the printed ' +
        'schedule shows the values carried at issue. Save the board to start revision 3 and send it for review if ' +
        'the change matters.',
    );
    // Only the kinds of event it needs, so a long history since (a walk) cannot push them off the page
    expect(
      fetch.mock.calls.some(
        ([u]) => String(u) === `/api/boards/${BOARD}/audit?actions=board.supply-changed,review.approved`,
      ),
    ).toBe(true);
  });

  it('labels matched on site: still said', async () => {
    serve([supplyChanged, entry('board.labels-matched', '2026-11-12T10:00:00.000Z'), approved]);
    renderWithQuery(<DerivedSupply board={board('labels-matched')} canEdit />);
    expect(await screen.findByTestId('supply-changed-since-issue')).toBeTruthy();
  });

  it('says nothing when the change came before the issue', async () => {
    const fetch = serve([{ ...approved, createdAt: '2026-11-25T10:00:00.000Z' }, supplyChanged]);
    renderWithQuery(<DerivedSupply board={board('issued')} canEdit />);
    await waitFor(() => expect(fetch.mock.calls.some(([u]) => String(u).includes('/audit'))).toBe(true));
    // The history has loaded (its changed ways are shown), and no flag with it
    await screen.findByTestId('supply-change');
    expect(screen.queryByTestId('supply-changed-since-issue')).toBeNull();
  });

  it('says nothing on a draft (its next issue will carry the new values)', async () => {
    const fetch = serve([supplyChanged, approved]);
    renderWithQuery(<DerivedSupply board={board('draft', 3)} canEdit />);
    await waitFor(() => expect(fetch.mock.calls.some(([u]) => String(u).includes('/audit'))).toBe(true));
    // The history has loaded (its changed ways are shown), and no flag with it
    await screen.findByTestId('supply-change');
    expect(screen.queryByTestId('supply-changed-since-issue')).toBeNull();
  });
});
