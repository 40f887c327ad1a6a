import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { MembersView } from '@/features/members/components/members-view';
import type { Member } from '@/lib/members/types';

import { json, mockFetch, renderWithQuery, sentBody } from './helpers';

const ADMIN = '11111111-1111-4111-8111-111111111111';
const DESIGNER = '22222222-2222-4222-8222-222222222222';

const person = (over: Partial<Member>): Member => ({
  id: '',
  name: '',
  email: '',
  role: 'designer',
  active: true,
  pending: false,
  createdAt: '2025-01-01T09:00:00.000Z',
  ...over,
});

const members: Member[] = [
  person({ id: ADMIN, name: 'Alex Rowe', email: 'admin@example.test', role: 'admin' }),
  person({ id: DESIGNER, name: 'Dana Finch', email: 'designer@example.test' }),
  person({
    id: '33333333-3333-4333-8333-333333333333',
    name: 'Sam Hale',
    email: 'sam@example.test',
    role: 'inspector',
    active: false,
    pending: true,
  }),
];

afterEach(() => {
  vi.unstubAllGlobals();
});

/** The members screen as the admin, with the answers a role change gets. */
function renderForRoleChange() {
  const user = userEvent.setup();
  const fetch = mockFetch(json({ members }), json({ member: { ...members[1], role: 'inspector' } }), json({ members }));
  renderWithQuery(<MembersView currentUserId={ADMIN} />);
  return { user, fetch };
}

describe('MembersView', () => {
  it('lists members and waiting invitations apart, and guards the admin’s own row', async () => {
    mockFetch(json({ members }));
    renderWithQuery(<MembersView currentUserId={ADMIN} />);
    const table = await screen.findByRole('table', { name: 'Members' });
    expect(within(table).getByText('Dana Finch')).toBeTruthy();
    expect(within(table).queryByText('Sam Hale')).toBeNull();
    const waiting = screen.getByRole('table', { name: /waiting/i });
    expect(within(waiting).getByText('Sam Hale')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Deactivate Alex Rowe' })).toBeNull();
    expect(screen.queryByRole('combobox', { name: 'Role of Alex Rowe' })).toBeNull();
  });

  it('draws each member and invitation as a card on a phone, with the same controls', async () => {
    const { user, fetch } = renderForRoleChange();
    const cards = within(await screen.findByRole('list', { name: 'Members' })).getAllByRole('listitem');
    expect(cards.map((c) => c.querySelector('.font-medium')?.textContent)).toEqual(['Alex Rowe(you)', 'Dana Finch']);
    const dana = within(cards[1]);
    // Under the name, the e-mail; the access as the card's badge; the joining date as a named field
    expect(cards[1].textContent).toContain('designer@example.test');
    expect(dana.getByText('Active')).toBeTruthy();
    expect(dana.getByText('Member since')).toBeTruthy();
    expect(dana.getByRole('button', { name: 'Deactivate Dana Finch' })).toBeTruthy();
    // The admin's own card has no role choice and no deactivation
    expect(within(cards[0]).queryByRole('combobox')).toBeNull();
    expect(within(cards[0]).queryByRole('button')).toBeNull();
    await user.selectOptions(dana.getByRole('combobox', { name: 'Role of Dana Finch' }), 'inspector');
    await waitFor(() => expect(fetch).toHaveBeenCalledTimes(3));
    expect(sentBody(fetch, 1)).toEqual({ role: 'inspector' });
    const waiting = within(screen.getByRole('list', { name: /waiting/i })).getAllByRole('listitem');
    expect(waiting).toHaveLength(1);
    expect(waiting[0].textContent).toContain('Sam Hale');
    expect(waiting[0].textContent).toContain('Inspector');
    // The cards are the phone's, the tables the wider screens'
    for (const list of screen.getAllByTestId('row-cards')) expect(list.className).toContain('md:hidden');
  });

  it('changes a role with PATCH', async () => {
    const { user, fetch } = renderForRoleChange();
    const table = within(await screen.findByRole('table', { name: 'Members' }));
    const role = table.getByRole('combobox', { name: 'Role of Dana Finch' });
    await user.selectOptions(role, 'inspector');
    await waitFor(() => expect(fetch).toHaveBeenCalledTimes(3));
    expect(fetch.mock.calls[1][0]).toBe(`/api/members/${DESIGNER}`);
    expect(fetch.mock.calls[1][1]?.method).toBe('PATCH');
    expect(sentBody(fetch, 1)).toEqual({ role: 'inspector' });
  });

  it('asks before deactivating, then sends active: false', async () => {
    const user = userEvent.setup();
    const fetch = mockFetch(
      json({ members }),
      json({ member: { ...members[1], active: false } }),
      json({ members: [members[0], { ...members[1], active: false }] }),
    );
    renderWithQuery(<MembersView currentUserId={ADMIN} />);
    const table = within(await screen.findByRole('table', { name: 'Members' }));
    await user.click(table.getByRole('button', { name: 'Deactivate Dana Finch' }));
    expect(fetch).toHaveBeenCalledTimes(1);
    await user.click(screen.getByRole('button', { name: 'Deactivate' }));
    expect(await table.findByRole('button', { name: 'Reactivate Dana Finch' })).toBeTruthy();
    expect(sentBody(fetch, 1)).toEqual({ active: false });
  });
});
