import { DndContext } from '@dnd-kit/core';
import { act, fireEvent, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';

import { DrawnBoard } from '@/features/board-editor/components/drawn-board';
import { useBoardDraftStore } from '@/features/board-editor/stores/board-draft-store';
import { deviceFromChoice } from '@/features/board-editor/utils/device-catalogue';
import { boardSizingInput } from '@/lib/boards/sizing-input';
import { boardInputSchema, sizeBoard, type BoardResult } from '@/lib/sizing';

import { demoBoard } from './fixtures';
import { renderEditorPart } from './harness';

const store = () => useBoardDraftStore.getState();

beforeEach(() => {
  store().reset();
});

function renderBoard(showVerdicts = true, sized?: BoardResult) {
  return renderEditorPart(
    <DndContext>
      <DrawnBoard readOnly={false} showVerdicts={showVerdicts} />
    </DndContext>,
    sized,
  );
}

/** Way references as drawn, left to right, skipping devices without one. */
const drawnLabels = (container: HTMLElement) =>
  Array.from(container.querySelectorAll<HTMLElement>('[data-way-label]'))
    .map((el) => el.dataset.wayLabel)
    .filter(Boolean);

describe('the drawn board', () => {
  it('numbers a single-phase board 1, 2, 3 … and leaves the main switch and RCDs unnumbered', () => {
    store().load(demoBoard('flat'));
    const { container } = renderBoard();
    // Flat board: main switch, RCD, 4 MCBs, RCD, 4 MCBs, a blank (spare) = ways 1–9
    expect(drawnLabels(container)).toEqual(['1', '2', '3', '4', '5', '6', '7', '8', '9']);
    const cells = container.querySelectorAll('[data-way-id]');
    expect(cells[0].getAttribute('aria-label')).toBe('Main switch 2P 100 A');
    expect(cells[1].getAttribute('aria-label')).toBe('RCD 2P 63 A 30 mA type A');
  });

  it('numbers a three-phase board per phase; a three-pole device takes all three positions of a way', () => {
    store().load(demoBoard('workshop'));
    const { container } = renderBoard();
    const labels = drawnLabels(container);
    expect(labels.slice(0, 7)).toEqual(['1L1–L3', '2L1–L3', '3L1–L3', '4L1', '4L2', '4L3', '5L1']);
    expect(labels).toHaveLength(18);
    // The three-pole panel saw is drawn three modules wide
    const saw = screen.getByRole('button', { name: /Way 1L1–L3, 3-pole MCB C20, serves Panel saw/ });
    expect(saw.style.gridColumn).toBe('5 / span 3');
  });

  it('a single-pole way before a three-pole one leaves the skipped phase positions empty, drawn', () => {
    store().load(demoBoard('workshop'));
    // Put a single-pole MCB right after the main switch: the panel saw must move on to 2L1
    act(() => {
      store().addDevice(
        '00000000-0000-4000-8000-000000000001',
        deviceFromChoice('mcb', { poles: 1, curve: 'B', ratingA: 6 }),
        0,
        1,
      );
    });
    const { container } = renderBoard();
    expect(drawnLabels(container).slice(0, 2)).toEqual(['1L1', '2L1–L3']);
    expect(screen.getByText('2 phase positions left empty')).toBeTruthy();
  });

  it('shows free modules, and an RCD bracket naming the ways it protects', () => {
    store().load(demoBoard('flat'));
    renderBoard();
    // 15 of 18 modules used
    expect(screen.getByText('3 free modules')).toBeTruthy();
    expect(screen.getByText('15 of 18 modules used')).toBeTruthy();
    expect(screen.getByText('RCD 30 mA · 1, 2, 3, 4')).toBeTruthy();
    // The spare way 9 sits under the second RCD, as the engine and the schedule count it
    expect(screen.getByText('RCD 30 mA · 5, 6, 7, 8, 9')).toBeTruthy();
  });

  it('an RCBO added after the spare way is not under the RCD bracket: it protects itself (one rule with the schedule)', () => {
    store().load(demoBoard('flat'));
    act(() => {
      store().addDevice(
        '00000000-0000-4000-8000-0000000000aa',
        deviceFromChoice('rcbo', { poles: 1, curve: 'B', ratingA: 16, rcdMa: 30 }),
        0,
        store().ways.length,
      );
    });
    const { container } = renderBoard();
    expect(drawnLabels(container).at(-1)).toBe('10');
    expect(screen.getByText('RCD 30 mA · 5, 6, 7, 8, 9')).toBeTruthy();
    expect(screen.queryByText(/RCD 30 mA · .*10/)).toBeNull();
  });

  it('shows each way’s verdict as icon, colour and word, from the sizing of this draft', () => {
    const board = demoBoard('flat');
    store().load(board);
    // Make the cooker way fail: 10 kW on a B32 (Ib 43.5 A > In 32 A)
    const cooker = store().ways.find((w) => w.circuit?.serves === 'Cooker: oven and hob')!;
    store().updateCircuit(cooker.id, { ...cooker.circuit!, load: { kind: 'known', watts: 10_000, powerFactor: 1 } });
    const result = sizeBoard(boardInputSchema.parse(boardSizingInput(store().settings!, store().ways)));
    const { container } = renderBoard(true, result);
    const cell = container.querySelector(`[data-way-id="${cooker.id}"]`)!;
    // On the device: icon and colour (one module has no room for the word)
    const mark = cell.querySelector('[data-verdict]')!;
    expect(mark.getAttribute('data-verdict')).toBe('fails');
    expect(mark.querySelector('svg')).toBeTruthy();
    expect(mark.className).toContain('text-verdict-fail');
    expect(cell.getAttribute('aria-label')).toMatch(/serves Cooker: oven and hob, fails$/);
    // In the legend under the rail: the same icon and colour, with the word
    const entry = container.querySelector(`[data-legend-way="${cooker.id}"] [data-verdict]`)!;
    expect(entry.textContent).toBe('Fails');
    expect(entry.querySelector('svg')?.outerHTML).toBe(mark.querySelector('svg')?.outerHTML);
    expect(entry.className).toContain('text-verdict-fail');
    const passing = container.querySelectorAll('[data-way-id] [data-verdict="passes"]');
    expect(passing.length).toBe(result.summary.counts.passes);
  });

  it('a spare way says so; a click or Enter selects a device', async () => {
    const user = userEvent.setup();
    store().load(demoBoard('flat'));
    const { container } = renderBoard(false);
    // The blank: a dashed mark on the rail, "spare" in the legend
    expect(container.querySelectorAll('[data-way-id] [data-spare]')).toHaveLength(1);
    expect(screen.getByRole('list', { name: 'Ways on the rail' }).textContent).toContain('9Blank: spare');
    const [, , second, third] = container.querySelectorAll<HTMLElement>('[data-way-id]');
    // A plain click (the test's context starts a drag on pointer-down, so no pointer here)
    fireEvent.click(second);
    expect(store().selection).toEqual([second.dataset.wayId]);
    third.focus();
    await user.keyboard('{Enter}');
    expect(store().selection).toEqual([third.dataset.wayId]);
    expect(third.getAttribute('aria-pressed')).toBe('true');
  });

  it('every way’s reference, description and verdict are written level in the legend, nothing is turned', () => {
    store().load(demoBoard('workshop'));
    const result = sizeBoard(boardInputSchema.parse(boardSizingInput(store().settings!, store().ways)));
    const { container } = renderBoard(true, result);
    const cells = Array.from(container.querySelectorAll<HTMLElement>('[data-way-id]'));
    expect(cells.length).toBe(store().ways.length);
    for (const cell of cells) {
      const way = store().ways.find((w) => w.id === cell.dataset.wayId)!;
      const entry = container.querySelector<HTMLElement>(`[data-legend-way="${way.id}"]`)!;
      // Keyed by the way reference drawn on the device, with the device and the whole description
      if (cell.dataset.wayLabel) expect(entry.textContent).toContain(cell.dataset.wayLabel);
      if (way.circuit?.serves) expect(entry.textContent).toContain(way.circuit.serves);
      const verdict = result.ways.find((w) => w.id === way.id)?.result?.verdict;
      if (verdict) expect(entry.querySelector('[data-verdict]')?.getAttribute('data-verdict')).toBe(verdict);
      // The full words on hover and focus, the same as the device's name
      expect(cell.querySelector('[data-way-tip]')?.textContent).toBe(cell.getAttribute('aria-label'));
      expect(cell.querySelector('[data-way-tip]')?.className).toMatch(/group-hover:block.*group-focus-visible:block/);
    }
    // No text on the drawn board is written sideways
    expect(container.innerHTML).not.toMatch(/writing-mode|rotate-/);
  });
});
