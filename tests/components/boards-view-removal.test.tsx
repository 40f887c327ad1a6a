import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { BoardsView } from '@/features/boards/components/boards-view';
import type { BoardSummary } from '@/lib/boards/types';
import type { FeedChange } from '@/lib/sites/tree-types';

import { json, mockFetch, renderWithQuery } from './helpers';

// Removing a board that feeds other boards of its site: the server refuses with 409 naming them
// (lib/dal/site-feed.ts beforeBoardRemoval); the list must ask, naming them, and send the
// removal again confirmed, never leave the designer stuck with an error.

afterEach(() => {
  vi.unstubAllGlobals();
});

const SITE = '11111111-1111-4111-8111-111111111111';
const db1: BoardSummary = {
  id: 'aaaaaaaa-aaaa-4aaa-8aaa-aaaaaaaaaaaa',
  siteId: SITE,
  siteName: 'Hollin Lane Joinery workshop',
  name: 'Workshop DB1',
  location: 'Machine shop, north wall',
  phases: 1,
  status: 'draft',
  revision: 1,
  wayCount: 2,
  counts: { ways: 2, circuits: 2, spare: 0, positions: 12 },
  updatedAt: '2026-11-02T10:00:00.000Z',
  archivedAt: null,
  everIssued: false,
};
const fed: FeedChange = {
  boardId: 'bbbbbbbb-bbbb-4bbb-8bbb-bbbbbbbbbbbb',
  name: 'Finishing room board',
  from: {
    boardId: db1.id,
    boardName: 'Workshop DB1',
    wayId: 'cccccccc-cccc-4ccc-8ccc-cccccccccccc',
    wayLabel: '1',
    device: '',
    cable: '',
  },
  to: 'origin',
  reason: 'board-removed',
};
const refusal = () =>
  json(
    {
      error:
        'Deleting Workshop DB1 takes away the supply of Finishing room board, fed from its ways; confirm to feed it from the origin.',
      feedChanges: [fed],
    },
    409,
  );

describe('BoardsView: removing a board that feeds others', () => {
  it('a delete refused for the boards it feeds asks, naming them, then sends it confirmed', async () => {
    const user = userEvent.setup();
    const fetch = mockFetch(
      json({ boards: [db1] }),
      refusal(),
      json({ effect: 'deleted', feedChanges: [fed] }),
      json({ boards: [] }),
      json({ boards: [] }),
    );
    renderWithQuery(<BoardsView role="designer" siteId={SITE} />);
    await user.click((await screen.findAllByRole('button', { name: 'Delete Workshop DB1' }))[0]);

    const dialog = await screen.findByRole('dialog', { name: /delete this board/i });
    expect(within(dialog).getByText('Finishing room board')).toBeTruthy();
    expect(within(dialog).getByText(/fed now from Workshop DB1, way 1/)).toBeTruthy();
    // Not sent confirmed the first time
    expect(String(fetch.mock.calls[1][0])).toBe(`/api/boards/${db1.id}`);
    expect(fetch.mock.calls[1][1]?.method).toBe('DELETE');

    await user.click(within(dialog).getByRole('button', { name: 'Delete and feed from the origin' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(String(fetch.mock.calls[2][0])).toBe(`/api/boards/${db1.id}?confirmFeedChanges=1`);
    expect(fetch.mock.calls[2][1]?.method).toBe('DELETE');
  });

  it('keeping the board sends nothing more', async () => {
    const user = userEvent.setup();
    const fetch = mockFetch(json({ boards: [db1] }), refusal());
    renderWithQuery(<BoardsView role="designer" siteId={SITE} />);
    await user.click((await screen.findAllByRole('button', { name: 'Delete Workshop DB1' }))[0]);
    const dialog = await screen.findByRole('dialog', { name: /delete this board/i });
    await user.click(within(dialog).getByRole('button', { name: 'Keep it' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(fetch).toHaveBeenCalledTimes(2);
  });

  it('archiving an issued board (admins): the dialog names the fed boards after the first refusal', async () => {
    const user = userEvent.setup();
    const issued = { ...db1, status: 'issued' as const, everIssued: true };
    const fetch = mockFetch(
      json({ boards: [issued] }),
      refusal(),
      json({ effect: 'archived', feedChanges: [fed] }),
      json({ boards: [] }),
      json({ boards: [] }),
    );
    renderWithQuery(<BoardsView role="admin" siteId={SITE} />);
    await user.click((await screen.findAllByRole('button', { name: 'Archive Workshop DB1' }))[0]);
    const dialog = await screen.findByRole('dialog', { name: /archive this board/i });
    await user.click(within(dialog).getByRole('button', { name: 'Archive board' }));
    // The server named the fed board: the question now says so, and the next press confirms
    expect(await within(dialog).findByText('Finishing room board')).toBeTruthy();
    await user.click(within(dialog).getByRole('button', { name: 'Archive and feed from the origin' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(String(fetch.mock.calls[1][0])).toBe(`/api/boards/${db1.id}`);
    expect(String(fetch.mock.calls[2][0])).toBe(`/api/boards/${db1.id}?confirmFeedChanges=1`);
  });
});
