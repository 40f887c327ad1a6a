import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';

import { BoardsTable } from '@/features/boards/components/boards-table';
import type { BoardSummary } from '@/lib/boards/types';

const WORKSHOP = '11111111-1111-4111-8111-111111111111';
const FLAT = '22222222-2222-4222-8222-222222222222';

const boards: BoardSummary[] = [
  {
    id: 'aaaaaaaa-aaaa-4aaa-8aaa-aaaaaaaaaaaa',
    siteId: WORKSHOP,
    siteName: 'Oakley Joinery workshop',
    name: 'Workshop DB1',
    location: 'Machine shop, north wall',
    phases: 3,
    status: 'issued',
    revision: 2,
    wayCount: 12,
    counts: { ways: 12, circuits: 30, spare: 6, positions: 36 },
    updatedAt: '2025-03-02T10:00:00.000Z',
    archivedAt: null,
    everIssued: false,
  },
  {
    id: 'bbbbbbbb-bbbb-4bbb-8bbb-bbbbbbbbbbbb',
    siteId: FLAT,
    siteName: 'Flat above the workshop',
    name: 'Flat consumer unit',
    location: 'Hall cupboard',
    phases: 1,
    status: 'draft',
    revision: 1,
    wayCount: 8,
    counts: { ways: 8, circuits: 7, spare: 1, positions: null },
    updatedAt: '2025-03-04T10:00:00.000Z',
    archivedAt: null,
    everIssued: false,
  },
  {
    id: 'cccccccc-cccc-4ccc-8ccc-cccccccccccc',
    siteId: WORKSHOP,
    siteName: 'Oakley Joinery workshop',
    name: 'Spray booth sub-board',
    location: '',
    phases: 3,
    status: 'in-review',
    revision: 1,
    wayCount: 4,
    counts: { ways: 4, circuits: 3, spare: 1, positions: null },
    updatedAt: '2025-02-01T10:00:00.000Z',
    archivedAt: null,
    everIssued: false,
  },
  {
    id: 'dddddddd-dddd-4ddd-8ddd-dddddddddddd',
    siteId: WORKSHOP,
    siteName: 'Oakley Joinery workshop',
    name: 'Yard lighting',
    location: 'Store',
    phases: 1,
    status: 'labels-matched',
    revision: 3,
    wayCount: 2,
    counts: { ways: 2, circuits: 1, spare: 1, positions: null },
    updatedAt: '2025-01-10T10:00:00.000Z',
    archivedAt: null,
    everIssued: false,
  },
];

/** The board names in the order the table shows them. */
function shownNames(): string[] {
  const rows = within(screen.getByRole('table')).getAllByRole('row').slice(1);
  return rows.map((row) => within(row).getAllByRole('cell')[0].textContent ?? '');
}

function renderTable(props: Partial<React.ComponentProps<typeof BoardsTable>> = {}) {
  return render(<BoardsTable boards={boards} canEdit onRename={vi.fn()} onDelete={vi.fn()} {...props} />);
}

describe('BoardsTable', () => {
  it('draws each board as a card for a phone, with its stage beside its name', () => {
    renderTable();
    const cards = within(screen.getByRole('list', { name: 'Boards' })).getAllByRole('listitem');
    expect(cards).toHaveLength(4);
    const workshop = cards.find((c) => within(c).queryByRole('link', { name: 'Workshop DB1' }))!;
    expect(within(workshop).getByText('Issued')).toBeTruthy();
    expect(within(workshop).getByText('Three-phase')).toBeTruthy();
    expect(within(workshop).getByRole('button', { name: /rename workshop db1/i })).toBeTruthy();
    // Under the name: the site and the location, and the site alone for a board without one
    expect(workshop.textContent).toContain('Oakley Joinery workshop · Machine shop, north wall');
    const spray = cards.find((c) => within(c).queryByRole('link', { name: 'Spray booth sub-board' }))!;
    expect(spray.textContent).toContain('Oakley Joinery workshop');
    expect(spray.textContent).not.toContain('·');
    expect(spray.textContent).not.toContain('—');
    // The list is the phone's; the table the wider screens' (Tailwind's md breakpoint)
    expect(screen.getByTestId('row-cards').className).toContain('md:hidden');
    expect(screen.getByRole('table').parentElement!.className).toContain('hidden md:block');
  });

  it('lists the newest change first, with links to the editor and the site', () => {
    renderTable();
    expect(shownNames()).toEqual(['Flat consumer unit', 'Workshop DB1', 'Spray booth sub-board', 'Yard lighting']);
    expect(within(screen.getByRole('table')).getByRole('link', { name: 'Workshop DB1' }).getAttribute('href')).toBe(
      '/boards/aaaaaaaa-aaaa-4aaa-8aaa-aaaaaaaaaaaa',
    );
    const row = within(screen.getByRole('table')).getByRole('link', { name: 'Workshop DB1' }).closest('tr')!;
    expect(within(row).getByText('Three-phase')).toBeTruthy();
    expect(within(row).getByText('Issued')).toBeTruthy();
  });

  it('gives the true counts in the words of the editor and the schedule, and names the last stage for what it means', () => {
    renderTable();
    const table = within(screen.getByRole('table'));
    const workshop = table.getByRole('link', { name: 'Workshop DB1' }).closest('tr')!;
    expect(
      within(workshop).getByText('12 ways (36 single-pole positions): 30 circuits, 6 positions spare'),
    ).toBeTruthy();
    const flat = table.getByRole('link', { name: 'Flat consumer unit' }).closest('tr')!;
    expect(within(flat).getByText('8 ways: 7 circuits, 1 spare')).toBeTruthy();
    const yard = table.getByRole('link', { name: 'Yard lighting' }).closest('tr')!;
    expect(within(yard).getByText('Labels matched on site')).toBeTruthy();
    expect(screen.getByRole('option', { name: 'Labels matched on site' })).toBeTruthy();
    expect(document.body.textContent).not.toMatch(/verified/i);
  });

  it('filters by stage', async () => {
    const user = userEvent.setup();
    renderTable();
    const stage = screen.getByRole('combobox', { name: 'Stage' });
    await user.selectOptions(stage, 'draft');
    expect(shownNames()).toEqual(['Flat consumer unit']);
    await user.selectOptions(stage, 'in-review');
    expect(shownNames()).toEqual(['Spray booth sub-board']);
    await user.selectOptions(stage, 'labels-matched');
    expect(shownNames()).toEqual(['Yard lighting']);
    expect(screen.getByText('1 of 4 boards')).toBeTruthy();
    await user.selectOptions(stage, '');
    expect(shownNames()).toHaveLength(4);
  });

  it('combines the site filter, the stage filter and the search', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Site' }), WORKSHOP);
    expect(shownNames()).toEqual(['Workshop DB1', 'Spray booth sub-board', 'Yard lighting']);
    await user.type(screen.getByRole('searchbox', { name: /search boards/i }), 'store');
    expect(shownNames()).toEqual(['Yard lighting']);
    await user.selectOptions(screen.getByRole('combobox', { name: 'Stage' }), 'draft');
    expect(within(screen.getByRole('table')).getByText('No board matches these filters.')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Clear filters' }));
    expect(shownNames()).toHaveLength(4);
  });

  it('sorts the stage column by lifecycle, not alphabetically', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.click(screen.getByRole('button', { name: /stage/i }));
    expect(shownNames()).toEqual(['Flat consumer unit', 'Spray booth sub-board', 'Workshop DB1', 'Yard lighting']);
  });

  it('sorts by ways, most first', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.click(screen.getByRole('button', { name: /ways/i }));
    expect(shownNames()).toEqual(['Workshop DB1', 'Flat consumer unit', 'Spray booth sub-board', 'Yard lighting']);
  });

  it('hides the site column and filter on a site’s own page, and actions from readers', () => {
    renderTable({ singleSite: true, canEdit: false });
    expect(screen.queryByRole('combobox', { name: 'Site' })).toBeNull();
    expect(screen.queryByRole('columnheader', { name: /^site/i })).toBeNull();
    expect(screen.queryByRole('button', { name: /^rename /i })).toBeNull();
  });
});
