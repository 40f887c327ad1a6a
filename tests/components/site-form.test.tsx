import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { SiteFormDialog } from '@/features/sites/components/site-form';
import type { SiteSummary } from '@/lib/sites/types';

import { json, mockFetch, renderWithQuery, sentBody } from './helpers';

const saved: SiteSummary = {
  id: '11111111-1111-4111-8111-111111111111',
  name: 'Oakley Joinery workshop',
  client: 'Oakley Joinery Ltd',
  address: '4 Mill Lane, Hexford',
  boardCount: 0,
  updatedAt: '2025-03-02T10:00:00.000Z',
  archived: null,
};

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('SiteFormDialog', () => {
  it('refuses an empty name beside the field without calling the server', async () => {
    const user = userEvent.setup();
    const fetch = mockFetch();
    renderWithQuery(<SiteFormDialog open onClose={vi.fn()} />);
    // Spaces only: the schema trims them, so the name is still empty
    await user.type(screen.getByLabelText('Site name'), '   ');
    await user.click(screen.getByRole('button', { name: 'Create site' }));
    expect(await screen.findByText('Give the site a name.')).toBeTruthy();
    expect(screen.getByLabelText('Site name').getAttribute('aria-invalid')).toBe('true');
    expect(fetch).not.toHaveBeenCalled();
  });

  it('puts a server 400 issue onto its field', async () => {
    const user = userEvent.setup();
    const fetch = mockFetch(
      json(
        {
          error: 'Some fields are not valid.',
          issues: [{ path: 'client', message: 'The client name is too long for the schedule.' }],
        },
        400,
      ),
    );
    const onClose = vi.fn();
    renderWithQuery(<SiteFormDialog open onClose={onClose} />);
    await user.type(screen.getByLabelText('Site name'), 'Oakley Joinery workshop');
    await user.type(screen.getByLabelText('Client'), 'Oakley Joinery Ltd');
    await user.click(screen.getByRole('button', { name: 'Create site' }));
    expect(await screen.findByText('The client name is too long for the schedule.')).toBeTruthy();
    expect(screen.getByLabelText('Client').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByLabelText('Site name').getAttribute('aria-invalid')).toBeNull();
    expect(onClose).not.toHaveBeenCalled();
    expect(fetch).toHaveBeenCalledTimes(1);
    expect(fetch.mock.calls[0][0]).toBe('/api/sites');
    expect(fetch.mock.calls[0][1]?.method).toBe('POST');
  });

  it('shows an issue for a field the form lacks, and a non-field error message', async () => {
    const user = userEvent.setup();
    mockFetch(
      json(
        {
          error: 'Some fields are not valid.',
          issues: [{ path: 'colour', message: 'Unknown key.' }],
        },
        400,
      ),
      json({ error: 'The database is not reachable just now.' }, 503),
    );
    renderWithQuery(<SiteFormDialog open onClose={vi.fn()} />);
    await user.type(screen.getByLabelText('Site name'), 'Canal boathouse');
    await user.click(screen.getByRole('button', { name: 'Create site' }));
    expect(await screen.findByText('colour: Unknown key.')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Create site' }));
    expect(await screen.findByText('The database is not reachable just now.')).toBeTruthy();
  });

  it('creates a site with the trimmed fields and closes', async () => {
    const user = userEvent.setup();
    const fetch = mockFetch(json({ site: saved }, 201), json({ sites: [saved] }));
    const onClose = vi.fn();
    const onSaved = vi.fn();
    renderWithQuery(<SiteFormDialog open onClose={onClose} onSaved={onSaved} />);
    await user.type(screen.getByLabelText('Site name'), '  Oakley Joinery workshop ');
    await user.type(screen.getByLabelText('Address'), '4 Mill Lane, Hexford');
    await user.click(screen.getByRole('button', { name: 'Create site' }));
    await waitFor(() => expect(onClose).toHaveBeenCalled());
    expect(sentBody(fetch)).toEqual({
      name: 'Oakley Joinery workshop',
      client: '',
      address: '4 Mill Lane, Hexford',
    });
    expect(onSaved).toHaveBeenCalledWith(saved);
  });

  it('edits an existing site with PATCH, starting from its values', async () => {
    const user = userEvent.setup();
    const fetch = mockFetch(json({ site: { ...saved, name: 'Oakley workshop' } }));
    const onClose = vi.fn();
    renderWithQuery(<SiteFormDialog open site={saved} onClose={onClose} />);
    const name = screen.getByLabelText('Site name') as HTMLInputElement;
    expect(name.value).toBe('Oakley Joinery workshop');
    await user.clear(name);
    await user.type(name, 'Oakley workshop');
    await user.click(screen.getByRole('button', { name: 'Save site' }));
    await waitFor(() => expect(onClose).toHaveBeenCalled());
    expect(fetch.mock.calls[0][0]).toBe(`/api/sites/${saved.id}`);
    expect(fetch.mock.calls[0][1]?.method).toBe('PATCH');
    expect(sentBody(fetch)).toMatchObject({ name: 'Oakley workshop' });
  });
});
