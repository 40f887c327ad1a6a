import { DndContext } from '@dnd-kit/core';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';

import { DeviceTray } from '@/features/board-editor/components/device-tray';
import type { TrayKind } from '@/features/board-editor/utils/device-catalogue';

/** The tray of a board of `phases`, with the chip of `active` picked. */
function renderTray(phases: 1 | 3, active: TrayKind) {
  const view = render(
    <DndContext>
      <DeviceTray boardPhases={phases} onAdd={() => {}} />
    </DndContext>,
  );
  fireEvent.click(view.container.querySelector(`[data-tray-kind="${active}"]`)!);
  return view;
}

const chip = (kind: TrayKind) => document.querySelector(`[data-tray-kind="${kind}"]`)!.textContent;
const poles = (group: string) =>
  Array.from(
    within(screen.getByRole('group', { name: group }))
      .getByLabelText('Poles')
      .querySelectorAll('option'),
  ).map((o) => o.value);

describe('the device tray follows the board', () => {
  it('a three-phase board is offered four- and three-pole main switches and three-pole devices first', () => {
    renderTray(3, 'main-switch');
    expect(poles('Main switch choices')).toEqual(['4', '3']);
    expect(chip('main-switch')).toBe('Main switch 4P 100 A');
    expect(chip('mcb')).toBe('3-pole MCB B16');
    expect(chip('fuse-bs88-2')).toBe('3-pole BS 88-2 32 A');
    expect(chip('rcd')).toBe('RCD 4P 63 A 30 mA type A');
    expect(chip('spd')).toBe('SPD 4P');
    // Single-pole ways stay on offer, after the three-pole ones
    renderTray(3, 'mcb');
    expect(poles('MCB choices')).toEqual(['3', '1']);
  });

  it('a single-phase board is offered double-pole switches and single-pole devices first', () => {
    renderTray(1, 'main-switch');
    expect(poles('Main switch choices')).toEqual(['2', '4']);
    expect(chip('main-switch')).toBe('Main switch 2P 100 A');
    expect(chip('mcb')).toBe('MCB B16');
    expect(chip('rcd')).toBe('RCD 2P 63 A 30 mA type A');
  });
});
