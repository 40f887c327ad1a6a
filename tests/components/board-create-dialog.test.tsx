import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';

import { BoardCreateDialog } from '@/features/boards/components/board-create-dialog';

import { json, mockFetch, renderWithQuery, sentBody } from './helpers';

const push = vi.fn();
vi.mock('next/navigation', () => ({ useRouter: () => ({ push }) }));

const NEW_BOARD = 'eeeeeeee-eeee-4eee-8eee-eeeeeeeeeeee';
const FLAT = '22222222-2222-4222-8222-222222222222';
const sites = [
  { id: '11111111-1111-4111-8111-111111111111', name: 'Oakley Joinery workshop' },
  { id: FLAT, name: 'Flat above the workshop' },
];

afterEach(() => {
  vi.unstubAllGlobals();
  push.mockReset();
});

describe('BoardCreateDialog', () => {
  it('sends the defaults as numbers on the preselected site, then opens the board', async () => {
    const user = userEvent.setup();
    const fetch = mockFetch(
      json({ board: { id: NEW_BOARD, name: 'Flat consumer unit' } }, 201),
      json({ boards: [] }),
      json({ sites: [] }),
    );
    renderWithQuery(<BoardCreateDialog open onClose={vi.fn()} sites={sites} siteId={FLAT} />);
    await user.type(screen.getByLabelText('Board name'), 'Flat consumer unit');
    await user.click(screen.getByRole('button', { name: 'Create board' }));
    await waitFor(() => expect(push).toHaveBeenCalledWith(`/boards/${NEW_BOARD}`));
    expect(sentBody(fetch)).toEqual({
      name: 'Flat consumer unit',
      siteId: FLAT,
      location: '',
      phases: 1,
      supply: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.5, source: 'public' },
      incoming: { kind: 'main-switch', ratingA: 100 },
      enclosureModules: 18,
      rails: 1,
      dwelling: false,
    });
  });

  it('reads three-phase, a typed Ze and a busbar rating as numbers', async () => {
    const user = userEvent.setup();
    const fetch = mockFetch(json({ board: { id: 'x', name: 'Workshop DB1' } }, 201));
    renderWithQuery(<BoardCreateDialog open onClose={vi.fn()} sites={sites} />);
    await user.type(screen.getByLabelText('Board name'), 'Workshop DB1');
    await user.selectOptions(screen.getByLabelText('Site'), sites[0].id);
    await user.selectOptions(screen.getByLabelText('Phases'), '3');
    await user.clear(screen.getByLabelText('Ze (Ω)'));
    await user.type(screen.getByLabelText('Ze (Ω)'), '0.8');
    await user.selectOptions(screen.getByLabelText('Earthing'), 'TN-S');
    await user.type(screen.getByLabelText('Busbar rating (A)'), '125');
    await user.click(screen.getByLabelText('The board serves a dwelling'));
    await user.click(screen.getByRole('button', { name: 'Create board' }));
    await waitFor(() => expect(fetch).toHaveBeenCalled());
    expect(sentBody(fetch)).toMatchObject({
      siteId: sites[0].id,
      phases: 3,
      supply: { earthing: 'TN-S', zeOhm: 0.8 },
      incoming: { kind: 'main-switch', ratingA: 100, busbarRatingA: 125 },
      dwelling: true,
    });
  });

  it('names the fields left empty or out of range, and sends nothing', async () => {
    const user = userEvent.setup();
    const fetch = mockFetch();
    renderWithQuery(<BoardCreateDialog open onClose={vi.fn()} sites={sites} />);
    await user.clear(screen.getByLabelText('Ze (Ω)'));
    await user.clear(screen.getByLabelText('Enclosure (modules)'));
    await user.type(screen.getByLabelText('Enclosure (modules)'), '2');
    await user.click(screen.getByRole('button', { name: 'Create board' }));
    expect(await screen.findByText('Give the board a name.')).toBeTruthy();
    expect(screen.getByText('Choose one from the list.')).toBeTruthy();
    expect(screen.getByText('Enter a number.')).toBeTruthy();
    expect(screen.getByText('Use 4 or more.')).toBeTruthy();
    expect(screen.getByLabelText('Ze (Ω)').getAttribute('aria-invalid')).toBe('true');
    expect(fetch).not.toHaveBeenCalled();
  });

  it('maps a nested server issue onto its field', async () => {
    const user = userEvent.setup();
    mockFetch(
      json(
        {
          error: 'Some fields are not valid.',
          issues: [{ path: 'supply.pfcKa', message: 'Too high for this supply.' }],
        },
        400,
      ),
    );
    renderWithQuery(<BoardCreateDialog open onClose={vi.fn()} sites={sites} siteId={FLAT} />);
    await user.type(screen.getByLabelText('Board name'), 'Flat consumer unit');
    await user.click(screen.getByRole('button', { name: 'Create board' }));
    expect(await screen.findByText('Too high for this supply.')).toBeTruthy();
    expect(screen.getByLabelText('Prospective fault current (kA)').getAttribute('aria-invalid')).toBe('true');
    expect(push).not.toHaveBeenCalled();
  });

  it('points to the sites page when there is no site yet', () => {
    renderWithQuery(<BoardCreateDialog open onClose={vi.fn()} sites={[]} />);
    expect(screen.getByRole('link', { name: 'Go to sites' }).getAttribute('href')).toBe('/sites');
    expect(screen.queryByLabelText('Board name')).toBeNull();
  });
});
