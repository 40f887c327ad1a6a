import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { renderToString } from 'react-dom/server';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { WaysTable } from '@/features/review/components/ways-table';
import type { ReviewWayRow } from '@/lib/boards/review-page-data';

import { json, mockFetch, renderWithQuery } from '../helpers';

vi.mock('next/navigation', () => ({ useRouter: () => ({ refresh: vi.fn() }) }));

// Invented rows, as reviewPageData makes them (tests/unit/boards/review-page-data.test.ts)
const rows: ReviewWayRow[] = [
  {
    id: 'w1',
    ref: '1',
    serves: 'Bench sockets',
    loadType: 'Socket outlets',
    device: 'RCBO B20',
    figures: ['14.2', '2.5', '27.0', '1.84 (2.63)', '0.61 (2.19)'],
    sized: true,
    verdict: 'passes',
    comments: [
      {
        id: 'c1',
        wayId: 'w1',
        revision: 2,
        body: 'Check the run behind the bench',
        authorName: 'A. Inspector',
        createdAt: '2026-11-30T10:00:00.000Z',
        answeredAt: null,
      },
    ],
  },
  {
    id: 'w2',
    ref: '2',
    serves: null,
    loadType: null,
    device: 'MCB B16',
    figures: ['—', '—', '—', '—', '—'],
    sized: false,
    verdict: null,
    comments: [],
  },
];

afterEach(() => vi.unstubAllGlobals());

describe('WaysTable: the review page’s ways', () => {
  it('shows each way with its figures and verdict, a way without a circuit as spare', () => {
    renderWithQuery(<WaysTable boardId="b1" rows={rows} canComment />);
    const [, first, second] = screen.getAllByRole('row');
    within(first).getByText('Bench sockets');
    for (const f of rows[0].figures) within(first).getByText(f);
    within(first).getByText('Passes');
    within(second).getByText('Spare');
    expect(within(second).queryByText('Not sized')).toBeNull();
    screen.getByRole('columnheader', { name: 'Zs Ω (max)' });
  });

  it('opens a way: its checks load from the stored sizing, its comments show, with the form to add one', async () => {
    const fetch = mockFetch(
      json({ checks: [{ code: 'vd', ok: false, message: 'Volt drop 5.2 % over 5 %', reference: 'Appendix 4' }] }),
    );
    renderWithQuery(<WaysTable boardId="b1" rows={rows} canComment />);
    const toggle = screen.getByRole('button', { name: /comments on way 1/ });
    expect(toggle.getAttribute('aria-expanded')).toBe('false');
    await userEvent.click(toggle);
    expect(toggle.getAttribute('aria-expanded')).toBe('true');
    await screen.findByText(/Volt drop 5.2 % over 5 %/);
    expect(String(fetch.mock.calls[0][0])).toBe('/api/boards/b1/sizing/ways/w1');
    screen.getByText('Check the run behind the bench');
    screen.getByLabelText('Comment on way 1');
    // One way open at a time: opening the spare closes the first, and a spare has nothing to check
    await userEvent.click(screen.getByRole('button', { name: /comments on way 2/ }));
    expect(toggle.getAttribute('aria-expanded')).toBe('false');
    screen.getByText('No circuit to check.');
    expect(fetch).toHaveBeenCalledTimes(1);
  });

  it('offers no comment form to a reader who may not comment', async () => {
    renderWithQuery(<WaysTable boardId="b1" rows={rows} canComment={false} />);
    await userEvent.click(screen.getByRole('button', { name: /comments on way 2/ }));
    expect(screen.queryByLabelText('Comment on way 2')).toBeNull();
  });

  it('is drawn in the browser only: the server sends a placeholder of the table’s height, no rows', () => {
    const html = renderToString(<WaysTable boardId="b1" rows={rows} canComment />);
    expect(html).not.toContain('<table');
    expect(html).not.toContain('Bench sockets');
    expect(html).toContain('Loading 2 ways…');
  });
});
