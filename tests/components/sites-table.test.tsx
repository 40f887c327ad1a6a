import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';

import { SitesTable } from '@/features/sites/components/sites-table';
import type { SiteSummary } from '@/lib/sites/types';

const sites: SiteSummary[] = [
  {
    id: '11111111-1111-4111-8111-111111111111',
    name: 'Oakley Joinery workshop',
    client: 'Oakley Joinery Ltd',
    address: '4 Mill Lane, Hexford',
    boardCount: 1,
    updatedAt: '2025-03-02T10:00:00.000Z',
    archived: null,
  },
  {
    id: '22222222-2222-4222-8222-222222222222',
    name: 'Flat above the workshop',
    client: 'R. Oakley',
    address: '4a Mill Lane, Hexford',
    boardCount: 3,
    updatedAt: '2025-01-15T10:00:00.000Z',
    archived: null,
  },
  {
    id: '33333333-3333-4333-8333-333333333333',
    name: 'Canal boathouse',
    client: 'Hexford Rowing Club',
    address: 'Towpath, Hexford',
    boardCount: 0,
    updatedAt: '2025-02-20T10:00:00.000Z',
    archived: null,
  },
];

/** The site names in the order the table shows them. */
function shownNames(): string[] {
  const rows = within(screen.getByRole('table')).getAllByRole('row').slice(1);
  return rows.map((row) => within(row).getAllByRole('cell')[0].textContent ?? '');
}

function renderTable(canEdit = true) {
  return render(<SitesTable sites={sites} canEdit={canEdit} onRename={vi.fn()} onDelete={vi.fn()} />);
}

describe('SitesTable', () => {
  it('draws each site as a card for a phone: its name, its client under it, its boards', () => {
    render(
      <SitesTable
        sites={[...sites, { ...sites[2], id: '44444444-4444-4444-8444-444444444444', name: 'Yard', client: '' }]}
        canEdit={false}
        onRename={vi.fn()}
        onDelete={vi.fn()}
      />,
    );
    const cards = within(screen.getByRole('list', { name: 'Sites' })).getAllByRole('listitem');
    expect(cards).toHaveLength(4);
    const flat = cards.find((c) => within(c).queryByRole('link', { name: 'Flat above the workshop' }))!;
    expect(flat.textContent).toContain('R. Oakley');
    expect(within(flat).getByText('Boards').nextElementSibling?.textContent).toBe('3');
    // A site without a client: no empty line under its name
    const yard = cards.find((c) => within(c).queryByRole('link', { name: 'Yard' }))!;
    expect(yard.querySelector('p')).toBeNull();
    // The list is the phone's; the table the wider screens'
    expect(screen.getByTestId('row-cards').className).toContain('md:hidden');
  });

  it('starts sorted by name and reverses on a second click', async () => {
    const user = userEvent.setup();
    renderTable();
    expect(shownNames()).toEqual(['Canal boathouse', 'Flat above the workshop', 'Oakley Joinery workshop']);
    const header = screen.getByRole('columnheader', { name: /site/i });
    expect(header.getAttribute('aria-sort')).toBe('ascending');
    await user.click(within(header).getByRole('button'));
    expect(header.getAttribute('aria-sort')).toBe('descending');
    expect(shownNames()).toEqual(['Oakley Joinery workshop', 'Flat above the workshop', 'Canal boathouse']);
  });

  it('sorts by board count (most first) and by last change', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.click(screen.getByRole('button', { name: /boards/i }));
    expect(shownNames()).toEqual(['Flat above the workshop', 'Oakley Joinery workshop', 'Canal boathouse']);
    await user.click(screen.getByRole('button', { name: /last change/i }));
    expect(shownNames()).toEqual(['Oakley Joinery workshop', 'Canal boathouse', 'Flat above the workshop']);
  });

  it('sorts by client and by address', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.click(screen.getByRole('button', { name: /client/i }));
    expect(shownNames()[0]).toBe('Canal boathouse');
    await user.click(screen.getByRole('button', { name: /address/i }));
    expect(shownNames()).toEqual(['Oakley Joinery workshop', 'Flat above the workshop', 'Canal boathouse']);
  });

  it('filters by name, client or address and says when nothing matches', async () => {
    const user = userEvent.setup();
    renderTable();
    const search = screen.getByRole('searchbox', { name: /search sites/i });
    await user.type(search, 'mill lane');
    expect(shownNames()).toEqual(['Flat above the workshop', 'Oakley Joinery workshop']);
    expect(screen.getByText('2 of 3 sites')).toBeTruthy();
    await user.clear(search);
    await user.type(search, 'rowing');
    expect(shownNames()).toEqual(['Canal boathouse']);
    await user.clear(search);
    await user.type(search, 'substation');
    // Said in the table, and in place of the cards on a phone
    expect(screen.getAllByText(/no site matches/i)).toHaveLength(2);
  });

  it('links each site to its page and offers edit and archive only to editors', () => {
    const { unmount } = renderTable(true);
    // The table's (the phone's cards repeat them: the other test)
    const table = within(screen.getByRole('table'));
    const link = table.getByRole('link', { name: 'Canal boathouse' });
    expect(link.getAttribute('href')).toBe('/sites/33333333-3333-4333-8333-333333333333');
    expect(table.getAllByRole('button', { name: /^archive /i })).toHaveLength(3);
    unmount();
    renderTable(false);
    expect(screen.queryByRole('button', { name: /^archive /i })).toBeNull();
    expect(screen.queryByRole('button', { name: /^edit /i })).toBeNull();
  });

  it('shows skeleton rows while loading', () => {
    render(<SitesTable sites={[]} loading canEdit onRename={vi.fn()} onDelete={vi.fn()} />);
    expect(screen.getAllByTestId('skeleton-row').length).toBeGreaterThan(0);
    expect(screen.queryByText(/no site matches/i)).toBeNull();
  });
});
