import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import axe from 'axe-core';
import { describe, expect, it, vi } from 'vitest';

import { SiteDiagram } from '@/components/site-diagram/site-diagram';
import { sizeSite } from '@/lib/supply';

import { threeLevel, twoLevel } from '../../unit/supply/fixtures';

const site3 = sizeSite(threeLevel());

describe('SiteDiagram', () => {
  it('draws the origin and every board with its carried values and worst verdict in words', () => {
    render(<SiteDiagram site={site3} siteName="Hollin Lane Joinery" hrefOf={(id) => `/boards/${id}`} />);
    const svg = screen.getByRole('list').closest('svg')!;
    expect(svg.querySelector('title')?.textContent).toBe('Single-line diagram of Hollin Lane Joinery');
    const items = screen.getAllByRole('listitem');
    expect(items).toHaveLength(4); // origin + 3 boards
    expect(items[0].getAttribute('aria-label')).toContain('Ze 0.200 Ω');

    const fin = screen.getByRole('link', { name: /^Finishing room board:/ });
    expect(fin.getAttribute('href')).toBe('/boards/fin');
    const name = fin.getAttribute('aria-label')!;
    // The values of the hand-worked three-level tree (tests/unit/supply/carried-values.test.ts).
    expect(name).toContain('fed from Machine shop board, way 2L3');
    expect(name).toContain('earth fault loop impedance at the board 0.678 Ω');
    expect(name).toContain('prospective fault current 1.09 kA');
    expect(name).toContain('volt drop used above it 1.03 %');
    expect(name).toContain('on L3');
    expect(name).toMatch(/worst verdict: (Passes|Near limit|Fails)/);
    // Drawn text: the values, the verdict word and the sub-main's device and cable.
    const node = fin.closest('[role="listitem"]')!;
    expect(node.textContent).toContain('Zdb 0.678 Ω · PFC 1.09 kA');
    expect(node.textContent).toContain('MCB C20 (way 2L3), L3');
    expect(node.textContent).toContain('4 mm² twin and earth, 15 m, reference method C');
    expect(within(node as HTMLElement).getByText(/^(Passes|Near limit|Fails)$/)).toBeTruthy();
  });

  it('cuts a long name to its box with an ellipsis: the whole name is the tooltip and starts the link’s name', () => {
    const t = threeLevel();
    const long = 'Finishing room sub-distribution board beside the spray booth extract fan isolator';
    t.boards = t.boards.map((b) => (b.id === 'fin' ? { ...b, name: long } : b));
    render(<SiteDiagram site={sizeSite(t)} siteName="Site" hrefOf={(id) => `/boards/${id}`} />);
    const link = screen.getByRole('link', { name: new RegExp(`^${long}:`) });
    const text = link.querySelector('text')!;
    expect(text.querySelector('title')?.textContent).toBe(long);
    const shown = text.textContent!.replace(long, '');
    expect(shown).toBe('Finishing room sub-distribution board…');
    // Drawn in a box of its own, which clips what a wide name still runs over
    expect(text.closest('svg')!.getAttribute('width')).toBe(String(330 - 24));
    // A short name is drawn whole, without a tooltip
    const short = screen.getByRole('link', { name: /^Machine shop board:/ }).querySelector('text')!;
    expect(short.textContent).toBe('Machine shop board');
    expect(short.querySelector('title')).toBeNull();
  });

  it('opens a board by click and, without links, by keyboard as a button', async () => {
    const user = userEvent.setup();
    const onOpen = vi.fn();
    render(<SiteDiagram site={sizeSite(twoLevel())} siteName="Hollin Lane Joinery" onOpenBoard={onOpen} />);
    const buttons = screen.getAllByRole('button');
    expect(buttons.map((b) => b.getAttribute('aria-label')?.split(':')[0])).toEqual([
      'Workshop DB1',
      'Finishing room board',
    ]);
    await user.click(buttons[1]);
    expect(onOpen).toHaveBeenLastCalledWith('fin');
    // In the tab order (jsdom's tabbing skips SVG elements, so focus them directly).
    expect(buttons.map((b) => b.getAttribute('tabindex'))).toEqual(['0', '0']);
    buttons[0].focus();
    expect(document.activeElement).toBe(buttons[0]);
    await user.keyboard('{Enter}');
    expect(onOpen).toHaveBeenLastCalledWith('db1');
    buttons[1].focus();
    await user.keyboard(' ');
    expect(onOpen).toHaveBeenLastCalledWith('fin');
  });

  it('links call the callback too, and keep their href for a new tab', async () => {
    const user = userEvent.setup();
    const onOpen = vi.fn();
    render(<SiteDiagram site={site3} siteName="Hollin Lane" hrefOf={(id) => `#${id}`} onOpenBoard={onOpen} />);
    await user.click(screen.getByRole('link', { name: /^Machine shop board:/ }));
    expect(onOpen).toHaveBeenCalledWith('ms');
  });

  it('has no axe-core violations (WCAG 2.1 A and AA; contrast is checked in Chromium)', async () => {
    const { container } = render(<SiteDiagram site={site3} siteName="Hollin Lane" hrefOf={(id) => `/boards/${id}`} />);
    const result = await axe.run(container, {
      runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] },
      rules: { 'color-contrast': { enabled: false } },
    });
    expect(result.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
  });

  it('lays out 30 boards in one column, scaling by its viewBox', () => {
    const t = twoLevel();
    for (let i = 0; i < 28; i += 1) {
      t.boards.push({ ...t.boards[0], id: `extra-${i}`, name: `Store board ${i + 1}` });
    }
    const s = sizeSite(t);
    const t0 = performance.now();
    const { container } = render(<SiteDiagram site={s} siteName="Big site" hrefOf={(id) => `/b/${id}`} />);
    const ms = performance.now() - t0;
    expect(screen.getAllByRole('link')).toHaveLength(30);
    const svg = container.querySelector('svg')!;
    expect(svg.getAttribute('width')).toBe('100%');
    expect(svg.getAttribute('viewBox')).toMatch(/^0 0 \d+/);
    // A note, not a timed check: jsdom is far slower than Chromium.
    console.info(`SiteDiagram: 30 boards rendered in jsdom in ${ms.toFixed(1)} ms`);
  });
});
