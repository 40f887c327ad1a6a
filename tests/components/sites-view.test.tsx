import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { SitesView } from '@/features/sites/components/sites-view';

import { json, mockFetch, renderWithQuery } from './helpers';

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('SitesView', () => {
  it('shows the empty state with a create button for a designer', async () => {
    mockFetch(json({ sites: [] }));
    renderWithQuery(<SitesView role="designer" />);
    expect(await screen.findByText('No sites yet')).toBeTruthy();
    expect(screen.getByRole('button', { name: /new site/i })).toBeTruthy();
  });

  it('offers no create button to an installer', async () => {
    mockFetch(json({ sites: [] }));
    renderWithQuery(<SitesView role="installer" />);
    expect(await screen.findByText('No sites yet')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /new site/i })).toBeNull();
  });

  it('shows the server’s message on failure and loads again on retry', async () => {
    const user = userEvent.setup();
    const fetch = mockFetch(
      json({ error: 'The database is not reachable just now.' }, 503),
      json({
        sites: [
          {
            id: '33333333-3333-4333-8333-333333333333',
            name: 'Canal boathouse',
            client: '',
            address: '',
            boardCount: 0,
            updatedAt: '2025-02-20T10:00:00.000Z',
          },
        ],
      }),
    );
    renderWithQuery(<SitesView role="admin" />);
    expect(await screen.findByText('The database is not reachable just now.')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: /try again/i }));
    expect(await within(await screen.findByRole('table')).findByRole('link', { name: 'Canal boathouse' })).toBeTruthy();
    await waitFor(() => expect(fetch).toHaveBeenCalledTimes(2));
  });

  it('asks before archiving and sends DELETE, which archives the chosen site', async () => {
    const user = userEvent.setup();
    const site = {
      id: '22222222-2222-4222-8222-222222222222',
      name: 'Flat above the workshop',
      client: '',
      address: '',
      boardCount: 1,
      updatedAt: '2025-01-15T10:00:00.000Z',
    };
    const fetch = mockFetch(
      json({ sites: [site] }),
      json({ site: { ...site, archived: { at: '2025-02-01T10:00:00.000Z', byName: 'Tom Reyes' } } }),
      json({ sites: [] }),
    );
    renderWithQuery(<SitesView role="designer" />);
    const table = within(await screen.findByRole('table'));
    await user.click(await table.findByRole('button', { name: 'Archive Flat above the workshop' }));
    expect(screen.getByRole('dialog', { name: 'Archive this site?' }).textContent).toMatch(
      /and its board leave the lists and become read-only\. Nothing is deleted/,
    );
    await user.click(screen.getByRole('button', { name: 'Archive site' }));
    expect(await screen.findByText('No sites yet')).toBeTruthy();
    expect(fetch.mock.calls[1][0]).toBe(`/api/sites/${site.id}`);
    expect(fetch.mock.calls[1][1]?.method).toBe('DELETE');
  });
});
