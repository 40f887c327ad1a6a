import { DndContext } from '@dnd-kit/core';
import { act, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
// @ts-expect-error -- its types are not reachable through the package's exports map
import { computeAccessibleName } from 'dom-accessibility-api';
import { beforeEach, describe, expect, it, vi } from 'vitest';

import { WayPanel } from '@/features/board-editor/components/way-panel';
import { useBoardDraftStore } from '@/features/board-editor/stores/board-draft-store';
import { boardSizingInput } from '@/lib/boards/sizing-input';
import { CIRCUIT_FIELD_LABELS } from '@/lib/names';
import { boardInputSchema, sizeBoard, type BoardResult } from '@/lib/sizing';

import { demoBoard } from './fixtures';
import { renderEditorPart } from './harness';

const store = () => useBoardDraftStore.getState();

function openWay(serves: string) {
  const way = store().ways.find((w) => w.circuit?.serves === serves)!;
  act(() => store().select(way.id));
  return way;
}

const circuitOf = (id: string) => store().ways.find((w) => w.id === id)!.circuit!;

beforeEach(() => {
  store().reset();
});

function renderPanel(readOnly = false, sized?: BoardResult) {
  const onRemove = vi.fn();
  renderEditorPart(
    <DndContext>
      <WayPanel readOnly={readOnly} showSizing onRemove={onRemove} />
    </DndContext>,
    sized,
  );
  return { onRemove };
}

describe('the way panel', () => {
  it('asks for a selection when no way is selected', () => {
    store().load(demoBoard('flat'));
    renderPanel();
    expect(screen.getByText(/Select a device on the board/)).toBeTruthy();
  });

  it('an empty or out-of-range length shows a field error and leaves the draft alone', async () => {
    const user = userEvent.setup();
    store().load(demoBoard('flat'));
    const way = openWay('Immersion heater, airing cupboard');
    renderPanel();
    const length = screen.getByLabelText('Length (m)');
    expect((length as HTMLInputElement).value).toBe('9');

    await user.clear(length);
    expect(await screen.findByText('Enter a number.')).toBeTruthy();
    expect(length.getAttribute('aria-invalid')).toBe('true');
    expect(circuitOf(way.id).lengthM).toBe(9);

    await user.type(length, '0');
    expect(await screen.findByText('Use more than 0.')).toBeTruthy();
    expect(circuitOf(way.id).lengthM).toBe(9);
    expect(store().past).toHaveLength(0);
  });

  it('input that is not valid yet is still there after selecting another way and coming back', async () => {
    const user = userEvent.setup();
    store().load(demoBoard('flat'));
    const way = openWay('Immersion heater, airing cupboard');
    renderPanel();
    const length = screen.getByLabelText('Length (m)');
    await user.clear(length);
    await user.type(length, '-3');
    expect(await screen.findByText('Use more than 0.')).toBeTruthy();

    // Another way, then back: the typed value and its error are shown again
    openWay('Smoke and heat alarms');
    expect((screen.getByLabelText('Length (m)') as HTMLInputElement).value).toBe('24');
    act(() => store().select(way.id));
    expect((screen.getByLabelText('Length (m)') as HTMLInputElement).value).toBe('-3');
    expect(await screen.findByText('Use more than 0.')).toBeTruthy();
    // The draft still holds the last valid length
    expect(circuitOf(way.id).lengthM).toBe(9);
  });

  it('a valid change goes into the draft as one undo step', async () => {
    const user = userEvent.setup();
    store().load(demoBoard('flat'));
    const way = openWay('Immersion heater, airing cupboard');
    renderPanel();
    const length = screen.getByLabelText('Length (m)');
    await user.clear(length);
    await user.type(length, '27');
    expect(circuitOf(way.id).lengthM).toBe(27);
    expect(store().dirty).toBe(true);

    await user.type(screen.getByLabelText('Load (W)'), '0');
    expect(circuitOf(way.id).load).toEqual({ kind: 'known', watts: 30000, powerFactor: 1 });
    // Typing "2", "7" in the length is one step, the load another
    expect(store().past).toHaveLength(2);
  });

  it('offers only the installation methods the chosen cable has, and keeps the method valid', async () => {
    const user = userEvent.setup();
    store().load(demoBoard('flat'));
    const way = openWay('Immersion heater, airing cupboard');
    renderPanel();
    const methods = () =>
      within(screen.getByLabelText('Reference method'))
        .getAllByRole('option')
        .map((o) => (o as HTMLOptionElement).value);
    expect(methods()).toEqual(['100', '101', '102', '103', 'A', 'C']);

    await user.selectOptions(screen.getByLabelText('Cable'), 'swa-xlpe-90');
    expect(methods()).toEqual(['C', 'D', 'E']);
    expect(circuitOf(way.id)).toMatchObject({ cable: 'swa-xlpe-90', method: 'C' });

    await user.selectOptions(screen.getByLabelText('Reference method'), 'D');
    expect(circuitOf(way.id).method).toBe('D');
  });

  it('switches the load to a socket arrangement, and fixes the cable size when asked', async () => {
    const user = userEvent.setup();
    store().load(demoBoard('flat'));
    const way = openWay('Immersion heater, airing cupboard');
    renderPanel();
    await user.selectOptions(screen.getByLabelText('Use'), 'sockets');
    await user.selectOptions(screen.getByLabelText('Load given as'), 'socket-arrangement');
    expect(circuitOf(way.id).load).toEqual({ kind: 'socket-arrangement', arrangement: 'ring-32', floorAreaM2: 50 });
    await user.selectOptions(screen.getByLabelText('Cable size'), '4');
    expect(circuitOf(way.id).csaMm2).toBe(4);
    await user.selectOptions(screen.getByLabelText('Cable size'), '');
    expect(circuitOf(way.id).csaMm2).toBeNull();
  });

  it('a socket arrangement on a lighting circuit is refused with the schema’s message', async () => {
    const user = userEvent.setup();
    store().load(demoBoard('flat'));
    const way = openWay('Sockets: kitchen and utility (ring)');
    renderPanel();
    await user.selectOptions(screen.getByLabelText('Use'), 'lighting');
    expect(await screen.findByText('a socket arrangement is a sockets circuit')).toBeTruthy();
    expect(circuitOf(way.id).use).toBe('sockets');
  });

  it('device details: a fixed rating can go back to "choose for me"', async () => {
    const user = userEvent.setup();
    store().load(demoBoard('flat'));
    const way = openWay('Immersion heater, airing cupboard');
    renderPanel();
    await user.selectOptions(screen.getByLabelText('Rating'), '');
    expect(store().ways.find((w) => w.id === way.id)!.device.ratingA).toBeNull();
    await user.selectOptions(screen.getByLabelText('Curve'), 'C');
    expect(store().ways.find((w) => w.id === way.id)!.device.curve).toBe('C');
  });

  it('undo from elsewhere puts the old value back in the field', async () => {
    const user = userEvent.setup();
    store().load(demoBoard('flat'));
    openWay('Immersion heater, airing cupboard');
    renderPanel();
    const length = screen.getByLabelText('Length (m)') as HTMLInputElement;
    await user.clear(length);
    await user.type(length, '31');
    act(() => store().undo());
    expect(length.value).toBe('9');
  });

  it('shows the full sizing of the way: figures, each check with its reference, and the caution', () => {
    const board = demoBoard('flat');
    store().load(board);
    const way = openWay('Cooker: oven and hob');
    const result = sizeBoard(boardInputSchema.parse(boardSizingInput(board.settings, board.ways)));
    renderPanel(false, result);
    const section = screen.getByRole('region', { name: 'Sizing result' });
    const sized = result.ways.find((w) => w.id === way.id)!.result!;
    expect(within(section).getByText('Design current Ib').nextSibling?.textContent).toContain(
      `${sized.ibA.toFixed(2)} A`,
    );
    for (const check of sized.checks) {
      const item = section.querySelector(`[data-check="${check.code}"]`)!;
      expect(item.textContent).toContain(check.message);
      expect(item.textContent).toContain(check.reference);
    }
    expect(within(section).getByRole('note', { name: 'Caution' }).textContent).toMatch(/competent person/);
    expect(within(section).getAllByText(/Passes|Near limit|Fails/).length).toBeGreaterThan(0);
  });

  it('read-only: every field is disabled and there is no remove button', () => {
    store().load(demoBoard('flat'));
    openWay('Immersion heater, airing cupboard');
    renderPanel(true);
    // Disabled through the form's fieldset
    expect(screen.getByLabelText('Length (m)').matches(':disabled')).toBe(true);
    expect(screen.getByLabelText('Rating').matches(':disabled')).toBe(true);
    expect(screen.queryByRole('button', { name: /Remove/ })).toBeNull();
  });
});

describe('the way panel speaks one language with quick size', () => {
  it('every control is named by its visible label (WCAG 2.1 label in name)', () => {
    store().load(demoBoard('flat'));
    openWay('Cooker: oven and hob');
    renderPanel();
    const controls = [...document.querySelectorAll('input, select')] as (HTMLInputElement | HTMLSelectElement)[];
    expect(controls.length).toBeGreaterThan(15);
    for (const control of controls) {
      const visible = [...(control.labels ?? [])].map((l) => l.textContent?.trim() ?? '').join(' ');
      expect(visible, control.outerHTML).not.toBe('');
      expect(computeAccessibleName(control), control.outerHTML).toContain(visible);
    }
  });

  it('the circuit fields carry the shared names of lib/names.ts (the same component draws quick size)', () => {
    store().load(demoBoard('flat'));
    openWay('Towel rail and extract fan, bathroom');
    renderPanel();
    for (const label of [
      'Kind of load',
      'Reference method',
      'Circuits grouped',
      'Where it goes',
      'Load given as',
      'Run in insulation (mm)',
    ]) {
      expect(screen.getByLabelText(label)).toBeTruthy();
    }
    expect((screen.getByLabelText('Kind of load') as HTMLSelectElement).value).toBe('other');
    expect((screen.getByLabelText('Where it goes') as HTMLSelectElement).value).toBe('bath-shower');
    expect(screen.getByLabelText(CIRCUIT_FIELD_LABELS.concealedInWall)).toBeTruthy();
    expect(screen.queryByText(/Buried in a wall/)).toBeNull();
  });

  it('choosing a kind of load and a special location goes into the draft', async () => {
    const user = userEvent.setup();
    store().load(demoBoard('flat'));
    const way = openWay('Immersion heater, airing cupboard');
    renderPanel();
    await user.selectOptions(screen.getByLabelText('Kind of load'), 'shower');
    expect(circuitOf(way.id).loadType).toBe('shower');
    await user.selectOptions(screen.getByLabelText('Where it goes'), 'bath-shower');
    expect(circuitOf(way.id).specialLocation).toBe('bath-shower');
    await user.selectOptions(screen.getByLabelText('Where it goes'), '');
    expect(circuitOf(way.id).specialLocation).toBeUndefined();
  });

  it('an RCD\u2019s residual current is labelled IΔn', () => {
    store().load(demoBoard('flat'));
    const rcd = store().ways.find((w) => w.device.kind === 'rcd')!;
    act(() => store().select(rcd.id));
    renderPanel();
    expect(screen.getByLabelText('IΔn')).toBeTruthy();
    expect(screen.queryByText('Trips at')).toBeNull();
  });
});
