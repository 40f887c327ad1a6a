import { screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { MailboxView } from '@/features/mailbox/components/mailbox-view';

import { json, mockFetch, renderWithQuery } from './helpers';

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('MailboxView', () => {
  it('shows the outbox with status, attempts and last error, and the caught messages', async () => {
    mockFetch(
      json({
        outbox: [
          {
            id: 'm1',
            toAddress: 'sam@example.test',
            subject: 'You are invited to Oakley Electrical on Boardwright',
            status: 'queued',
            attempts: 3,
            lastError: 'connect ECONNREFUSED 127.0.0.1:2525',
            createdAt: '2025-03-01T09:00:00.000Z',
            sentAt: null,
          },
          {
            id: 'm2',
            toAddress: 'dana@example.test',
            subject: 'Review wanted: Workshop DB1',
            status: 'sent',
            attempts: 1,
            lastError: null,
            createdAt: '2025-03-01T08:00:00.000Z',
            sentAt: '2025-03-01T08:00:05.000Z',
          },
        ],
        caught: [
          {
            id: 'c1',
            receivedAt: '2025-03-01T09:01:00.000Z',
            from: 'boardwright@example.test',
            to: ['dana@example.test'],
            subject: 'Board schedule: Workshop DB1',
            text: 'The schedule is attached.',
            html: '',
            attachments: [{ filename: 'workshop-db1.pdf', contentType: 'application/pdf', size: 2048 }],
          },
          { nonsense: true },
        ],
      }),
    );
    renderWithQuery(<MailboxView />);
    expect(screen.getByRole('heading', { name: 'Development outbox' })).toBeTruthy();
    const outbox = await screen.findByRole('table', { name: 'Outbox' });
    const row = within(outbox).getByText('sam@example.test').closest('tr')!;
    expect(within(row).getByText('Waiting')).toBeTruthy();
    expect(within(row).getByText('3')).toBeTruthy();
    expect(within(row).getByText('connect ECONNREFUSED 127.0.0.1:2525')).toBeTruthy();
    // Queued with its date and time, in the app's one format
    expect(row.querySelector('time')?.textContent).toMatch(/^1 Mar 2025, \d{2}:\d{2}$/);
    // On a phone, a card: the subject on top, the status beside it, the address under it
    const [card, sent] = within(screen.getByRole('list', { name: 'Outbox' })).getAllByRole('listitem');
    expect(card.firstElementChild!.textContent).toBe('You are invited to Oakley Electrical on BoardwrightWaiting');
    expect(card.textContent).toContain('sam@example.test');
    expect(within(card).getByText('Attempts').nextElementSibling?.textContent).toBe('3');
    expect(within(card).getByText('Last error')).toBeTruthy();
    // A message sent without an error: its card names no empty field
    expect(within(sent).queryByText('Last error')).toBeNull();
    expect(sent.textContent).not.toContain('—');
    expect(screen.getByText('Board schedule: Workshop DB1')).toBeTruthy();
    expect(screen.getByText(/workshop-db1\.pdf/)).toBeTruthy();
    expect(screen.getByText(/1 item\(s\) were not in the expected shape/)).toBeTruthy();
  });

  it('says when no mail catcher answered', async () => {
    mockFetch(json({ outbox: [], caught: null }));
    renderWithQuery(<MailboxView />);
    expect(await screen.findByText(/no mail catcher is configured/i)).toBeTruthy();
    expect(screen.getByText('Nothing has been queued yet.')).toBeTruthy();
  });
});
