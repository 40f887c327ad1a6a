import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { InviteForm } from '@/features/members/components/invite-form';

import { json, mockFetch, renderWithQuery, sentBody } from './helpers';

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('InviteForm', () => {
  it('names each bad field and sends nothing', async () => {
    const user = userEvent.setup();
    const fetch = mockFetch();
    renderWithQuery(<InviteForm />);
    await user.type(screen.getByLabelText('E-mail'), 'not-an-address');
    await user.click(screen.getByRole('button', { name: /send invitation/i }));
    expect(await screen.findByText('Enter a valid e-mail address.')).toBeTruthy();
    expect(screen.getByText('Enter the member’s name.')).toBeTruthy();
    expect(screen.getByLabelText('E-mail').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByLabelText('Name').getAttribute('aria-invalid')).toBe('true');
    expect(fetch).not.toHaveBeenCalled();
  });

  it('sends the cleaned-up invitation with the chosen role, then clears the form', async () => {
    const user = userEvent.setup();
    const fetch = mockFetch(json({ invitation: { id: 'x' } }, 201), json({ members: [] }));
    renderWithQuery(<InviteForm />);
    await user.type(screen.getByLabelText('E-mail'), '  Sam.Inspector@Example.test ');
    await user.type(screen.getByLabelText('Name'), 'Sam Hale');
    await user.selectOptions(screen.getByLabelText('Role'), 'inspector');
    await user.click(screen.getByRole('button', { name: /send invitation/i }));
    await waitFor(() => expect((screen.getByLabelText('Name') as HTMLInputElement).value).toBe(''));
    expect(fetch.mock.calls[0][0]).toBe('/api/members');
    expect(sentBody(fetch)).toEqual({
      email: 'sam.inspector@example.test',
      name: 'Sam Hale',
      role: 'inspector',
    });
  });

  it('shows the server’s refusal when the address already has an account', async () => {
    const user = userEvent.setup();
    mockFetch(json({ error: 'Someone with this e-mail address already has an account.' }, 409));
    renderWithQuery(<InviteForm />);
    await user.type(screen.getByLabelText('E-mail'), 'alex@example.test');
    await user.type(screen.getByLabelText('Name'), 'Alex Rowe');
    await user.click(screen.getByRole('button', { name: /send invitation/i }));
    expect(await screen.findByText('Someone with this e-mail address already has an account.')).toBeTruthy();
    expect((screen.getByLabelText('Name') as HTMLInputElement).value).toBe('Alex Rowe');
  });
});
