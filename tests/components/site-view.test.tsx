import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { SiteView } from '@/features/site-view/components/site-view';
import { SIZING_CAUTION } from '@/lib/sizing';

import { json, mockFetch, renderWithQuery, sentBody } from './helpers';
import { treeDto } from './site-tree-dto';

afterEach(() => vi.unstubAllGlobals());

describe('SiteView', () => {
  it('shows the diagram, the caution and each board in supply order with its carried values', async () => {
    mockFetch(json({ tree: treeDto() }));
    renderWithQuery(<SiteView siteId="site-1" siteName="Hollin Lane Joinery" canLink={false} />);
    const list = await screen.findByRole('list', { name: 'Boards of the site, in supply order' });
    const cards = within(list).getAllByRole('listitem');
    expect(cards.map((c) => within(c).getAllByRole('link')[0].textContent)).toEqual([
      'Workshop DB1',
      'Machine shop board',
      'Finishing room board',
    ]);
    // The hand-worked values of the three-level tree (tests/unit/supply/carried-values.test.ts)
    expect(cards[2].textContent).toContain('Zdb 0.678 Ω · PFC 1.09 kA · volt drop used 1.03 %');
    expect(cards[2].textContent).toContain('Fed from Machine shop board, way 2L3');
    expect(screen.getByRole('note', { name: 'Caution' }).textContent).toContain(SIZING_CAUTION);
    // The diagram's boards open their editors
    const svg = screen.getByTestId('site-diagram');
    expect(
      within(svg)
        .getByRole('link', { name: /^Finishing room board:/ })
        .getAttribute('href'),
    ).toBe('/boards/fin');
    // Read only: no choice of feed
    expect(screen.queryByLabelText('Fed from')).toBeNull();
  });

  it('states the selectivity below each sub-main, one line per judgement with its working', async () => {
    const tree = treeDto();
    mockFetch(json({ tree }));
    renderWithQuery(<SiteView siteId="site-1" siteName="Hollin Lane Joinery" canLink={false} />);
    const list = await screen.findByRole('list', { name: 'Boards of the site, in supply order' });
    const fin = within(list).getAllByRole('listitem')[2];
    const summary = within(fin).getByText(/^Selectivity below the sub-main \(advisory\):/);
    const groups = tree.boards[2].selectivity;
    expect(groups.length).toBeGreaterThan(0);
    // Worked in tests/unit/supply/carried-values.test.ts: C20 above the B16, selective up to 5 × 20 = 100 A
    expect(fin.textContent).toContain('Selective up to 100 A');
    // One judgement (the C20 above the B16), counted by its outcome
    expect(summary.textContent).toBe('Selectivity below the sub-main (advisory): 1 selective up to a stated current');
    for (const g of groups) expect(fin.textContent).toContain(g.working.text);
    // The origin's board has no sub-main above it: nothing to state
    expect(within(list).getAllByRole('listitem')[0].textContent).not.toContain('Selectivity');
  });

  it('says when a board is near the limit only through the selectivity below its sub-main', async () => {
    const tree = treeDto();
    // The fixture's finishing room: every way passes, and the C20 above its B16 is selective
    // only up to 100 A (advisory), which raises its worst verdict to near limit
    const fin = tree.boards.find((b) => b.boardId === 'fin')!;
    expect(fin.worstVerdict).toBe('near-limit');
    expect(fin.sizing!.summary.counts).toMatchObject({ nearLimit: 0, fails: 0 });
    // The same board, had one of its ways been near the limit itself
    const own = structuredClone(tree);
    own.boards.find((b) => b.boardId === 'fin')!.sizing!.summary.counts.nearLimit = 1;
    const note = 'from the selectivity below its sub-main (advisory); every way passes';

    mockFetch(json({ tree }));
    const { unmount } = renderWithQuery(<SiteView siteId="site-1" siteName="Hollin Lane Joinery" canLink={false} />);
    let cards = within(await screen.findByRole('list', { name: 'Boards of the site, in supply order' })).getAllByRole(
      'listitem',
    );
    expect(cards[2].textContent).toContain(note);
    // The board fed from the origin passes: nothing to say
    expect(cards[0].textContent).not.toContain(note);
    unmount();

    mockFetch(json({ tree: own }));
    renderWithQuery(<SiteView siteId="site-1" siteName="Hollin Lane Joinery" canLink={false} />);
    cards = within(await screen.findByRole('list', { name: 'Boards of the site, in supply order' })).getAllByRole(
      'listitem',
    );
    expect(cards[2].textContent).not.toContain(note);
  });

  it('asks before re-pointing a board, naming every board that changes, then sends the confirmed feed', async () => {
    const fetch = mockFetch(json({ tree: treeDto() }), json({ board: {}, ripple: null }), json({ tree: treeDto() }));
    renderWithQuery(<SiteView siteId="site-1" siteName="Hollin Lane Joinery" canLink />);
    await screen.findByRole('list', { name: 'Boards of the site, in supply order' });
    const selects = screen.getAllByLabelText('Fed from');
    // The machine shop board (second) to the origin: it and the finishing room below it change
    await userEvent.selectOptions(selects[1], 'origin');
    const dialog = await screen.findByRole('dialog', { name: 'Feed Machine shop board from elsewhere?' });
    expect(dialog.textContent).toContain(
      'Fed from Workshop DB1, way 1L1–L3 now; from the origin (the supply intake) after this.',
    );
    expect(within(dialog).getByRole('list', { name: 'Boards that change' }).textContent).toBe(
      'Machine shop boardFinishing room board',
    );
    await userEvent.click(within(dialog).getByRole('button', { name: 'Change the feed' }));
    await waitFor(() => expect(fetch).toHaveBeenCalledTimes(3));
    expect(fetch.mock.calls[1][0]).toBe('/api/boards/ms/feed');
    expect(fetch.mock.calls[1][1]?.method).toBe('PUT');
    expect(sentBody(fetch, 1)).toEqual({ feed: { from: 'origin' }, confirmFeedChanges: true });
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
  });

  it('offers the site pack to those who may print it: open, download, and e-mail with the address checked', async () => {
    const fetch = mockFetch(json({ tree: treeDto() }), json({ mail: { id: 'm1', to: 'client@example.test' } }, 202));
    renderWithQuery(<SiteView siteId="site-1" siteName="Hollin Lane Joinery" canLink={false} canPrint />);
    await screen.findByRole('list', { name: 'Boards of the site, in supply order' });
    expect(screen.getByRole('link', { name: 'Site pack (PDF)' }).getAttribute('href')).toBe('/api/sites/site-1/pack');
    expect(screen.getByRole('link', { name: 'Download the site pack' }).getAttribute('href')).toBe(
      '/api/sites/site-1/pack?download=1',
    );
    await userEvent.click(screen.getByText('E-mail the site pack'));
    // A bad address is refused on the field, and nothing is sent
    await userEvent.type(screen.getByLabelText('To'), 'not-an-address');
    await userEvent.click(screen.getByRole('button', { name: 'Send the pack' }));
    expect(await screen.findByText('Give a valid e-mail address.')).toBeTruthy();
    expect(fetch).toHaveBeenCalledTimes(1);
    await userEvent.clear(screen.getByLabelText('To'));
    await userEvent.type(screen.getByLabelText('To'), 'client@example.test');
    await userEvent.click(screen.getByRole('button', { name: 'Send the pack' }));
    await waitFor(() => expect(fetch).toHaveBeenCalledTimes(2));
    expect(fetch.mock.calls[1][0]).toBe('/api/sites/site-1/pack/email');
    expect(sentBody(fetch, 1)).toEqual({ to: 'client@example.test' });
  });

  it('offers no site pack to a member who may not print drafts', async () => {
    mockFetch(json({ tree: treeDto() }));
    renderWithQuery(<SiteView siteId="site-1" siteName="Hollin Lane Joinery" canLink={false} />);
    await screen.findByRole('list', { name: 'Boards of the site, in supply order' });
    expect(screen.queryByRole('link', { name: 'Site pack (PDF)' })).toBeNull();
  });

  it("shows the server's refusal of a loop and keeps the board's feed", async () => {
    const refusal = {
      error: 'Workshop DB1 cannot be fed from Finishing room board: the boards would feed each other in a loop.',
      issues: [{ path: 'feed', message: 'loop' }],
    };
    mockFetch(json({ tree: treeDto() }), json(refusal, 422));
    renderWithQuery(<SiteView siteId="site-1" siteName="Hollin Lane Joinery" canLink />);
    await screen.findByRole('list', { name: 'Boards of the site, in supply order' });
    const first = screen.getAllByLabelText('Fed from')[0] as HTMLSelectElement;
    // Workshop DB1 offered the machine shop's sub-main to the finishing room (below it): a loop
    await userEvent.selectOptions(first, 'ms:m-fin');
    const dialog = await screen.findByRole('dialog');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Change the feed' }));
    expect(await within(dialog).findByText(refusal.error)).toBeTruthy();
    expect(first.value).toBe('origin');
  });
});
