import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { AcceptInviteForm } from '@/features/members/components/accept-invite-form';

import { json, mockFetch, sentBody } from './helpers';

const GONE = 'This invitation link has been used or has expired. Ask for a new one.';
const TOKEN = 'tok_abcdefghijklmnopqrstuvwxyz0123456789';

afterEach(() => {
  vi.unstubAllGlobals();
});

async function choose(password: string, again = password) {
  const user = userEvent.setup();
  await user.type(screen.getByLabelText('Choose a password'), password);
  await user.type(screen.getByLabelText('Type it again'), again);
  await user.click(screen.getByRole('button', { name: /set password/i }));
}

describe('AcceptInviteForm', () => {
  it('applies the password rules before sending anything', async () => {
    const fetch = mockFetch();
    render(<AcceptInviteForm token={TOKEN} email="sam@example.test" />);
    await choose('short1');
    expect(await screen.findByText('Use at least 10 characters.')).toBeTruthy();
    expect(fetch).not.toHaveBeenCalled();
  });

  it('asks for a digit, and for the same password twice', async () => {
    const fetch = mockFetch();
    render(<AcceptInviteForm token={TOKEN} email="sam@example.test" />);
    await choose('onlyletters', 'onlyletterz');
    expect(await screen.findByText('Include at least one digit.')).toBeTruthy();
    expect(screen.getByText('The two passwords are not the same.')).toBeTruthy();
    expect(fetch).not.toHaveBeenCalled();
  });

  it('sends the token and password, then links to sign in', async () => {
    const fetch = mockFetch(json({ email: 'sam@example.test' }, 201));
    render(<AcceptInviteForm token={TOKEN} email="sam@example.test" />);
    await choose('panel-board-42');
    const link = await screen.findByRole('link', { name: 'Go to sign in' });
    expect(link.getAttribute('href')).toBe('/login');
    expect(fetch.mock.calls[0][0]).toBe('/api/invitations/accept');
    expect(sentBody(fetch)).toEqual({ token: TOKEN, password: 'panel-board-42' });
  });

  it('says plainly when the link has been used or has expired', async () => {
    mockFetch(json({ error: GONE }, 410));
    render(<AcceptInviteForm token={TOKEN} email="sam@example.test" />);
    await choose('panel-board-42');
    expect(await screen.findByText(GONE)).toBeTruthy();
    expect(screen.queryByLabelText('Choose a password')).toBeNull();
  });
});
