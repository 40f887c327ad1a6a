import { DndContext } from '@dnd-kit/core';
import { act, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';

import { EditorToolbar } from '@/features/board-editor/components/editor-toolbar';
import { WayPanel } from '@/features/board-editor/components/way-panel';
import { useUndoShortcuts } from '@/features/board-editor/hooks/use-undo-shortcuts';
import { useBoardDraftStore } from '@/features/board-editor/stores/board-draft-store';
import { useSaveStore } from '@/features/board-editor/stores/save-store';

import { demoBoard } from './fixtures';
import { renderEditorPart } from './harness';

const store = () => useBoardDraftStore.getState();
const wayOf = (id: string) => store().ways.find((w) => w.id === id)!;

/** The toolbar, the way panel and the editor's undo shortcuts, as the editor puts them together. */
function Editor() {
  useUndoShortcuts(true);
  return (
    <DndContext>
      <EditorToolbar
        siteName="Hollin Lane"
        canEdit
        canSubmit={false}
        readOnlyReason={null}
        submitting={false}
        onSave={() => {}}
        onSubmit={() => {}}
      />
      <WayPanel readOnly={false} showSizing onRemove={() => {}} />
    </DndContext>
  );
}

/**
 * A value with its object keys in the order PostgreSQL's jsonb gives them back (shorter keys
 * first, then by bytes; PostgreSQL manual, section 8.14 "JSON Types"): ways' devices and
 * circuits are jsonb columns, so a stored board reaches the editor in this order, not in the
 * order of the engine's schemas.
 */
function jsonbOrder<T>(value: T): T {
  if (Array.isArray(value)) return value.map(jsonbOrder) as T;
  if (value === null || typeof value !== 'object') return value;
  const keys = Object.keys(value).sort((a, b) => a.length - b.length || (a < b ? -1 : a > b ? 1 : 0));
  return Object.fromEntries(keys.map((k) => [k, jsonbOrder((value as Record<string, unknown>)[k])])) as T;
}

function openImmersion() {
  const board = demoBoard('flat');
  const stored = board.ways.map((w) => ({ ...w, device: jsonbOrder(w.device), circuit: jsonbOrder(w.circuit) }));
  store().load({ ...board, ways: stored });
  const way = store().ways.find((w) => w.circuit?.serves === 'Immersion heater, airing cupboard')!;
  act(() => store().select(way.id));
  renderEditorPart(<Editor />);
  return way;
}

const undoButton = () => screen.getByRole('button', { name: 'Undo' }) as HTMLButtonElement;
const redoButton = () => screen.getByRole('button', { name: 'Redo' }) as HTMLButtonElement;

beforeEach(() => {
  store().reset();
  useSaveStore.getState().reset();
});

// Typing through user-event in a full way panel takes seconds on a loaded machine
describe('redo after undoing a change made in the way panel', { timeout: 30_000 }, () => {
  it('a length: undo, then redo by the button, by Ctrl+Shift+Z and by Ctrl+Y', async () => {
    const user = userEvent.setup();
    const way = openImmersion();
    const length = screen.getByLabelText('Length (m)') as HTMLInputElement;
    expect(length.value).toBe('9');
    await user.clear(length);
    await user.type(length, '27');
    expect(wayOf(way.id).circuit!.lengthM).toBe(27);

    // Undo, then redo with the button
    await user.click(undoButton());
    expect(wayOf(way.id).circuit!.lengthM).toBe(9);
    expect(length.value).toBe('9');
    expect(redoButton().disabled).toBe(false);
    expect(store().future).toHaveLength(1);
    await user.click(redoButton());
    expect(wayOf(way.id).circuit!.lengthM).toBe(27);
    expect(length.value).toBe('27');

    // Undo, then redo with Ctrl+Shift+Z (focus on the toolbar, not in a text field)
    await user.click(undoButton());
    expect(wayOf(way.id).circuit!.lengthM).toBe(9);
    expect(redoButton().disabled).toBe(false);
    await user.keyboard('{Control>}{Shift>}z{/Shift}{/Control}');
    expect(wayOf(way.id).circuit!.lengthM).toBe(27);
    expect(length.value).toBe('27');

    // Undo by Ctrl+Z, then redo with Ctrl+Y
    await user.keyboard('{Control>}z{/Control}');
    expect(wayOf(way.id).circuit!.lengthM).toBe(9);
    expect(redoButton().disabled).toBe(false);
    await user.keyboard('{Control>}y{/Control}');
    expect(wayOf(way.id).circuit!.lengthM).toBe(27);
    expect(length.value).toBe('27');

    // Undo still does what it did: one step back to the loaded length, and nothing more
    await user.click(undoButton());
    expect(wayOf(way.id).circuit!.lengthM).toBe(9);
    expect(store().past).toHaveLength(0);
    expect(undoButton().disabled).toBe(true);
    expect(store().dirty).toBe(false);
  });

  it('a rating: undo, then redo by the button, by Ctrl+Shift+Z and by Ctrl+Y', async () => {
    const user = userEvent.setup();
    const way = openImmersion();
    const before = wayOf(way.id).device.ratingA;
    const rating = screen.getByLabelText('Rating') as HTMLSelectElement;
    const other = [...rating.options].map((o) => o.value).find((v) => v !== '' && Number(v) !== before)!;
    await user.selectOptions(rating, other);
    expect(wayOf(way.id).device.ratingA).toBe(Number(other));

    await user.click(undoButton());
    expect(wayOf(way.id).device.ratingA).toBe(before);
    expect(rating.value).toBe(before === null ? '' : String(before));
    expect(redoButton().disabled).toBe(false);
    await user.click(redoButton());
    expect(wayOf(way.id).device.ratingA).toBe(Number(other));
    expect(rating.value).toBe(other);

    await user.click(undoButton());
    expect(redoButton().disabled).toBe(false);
    await user.keyboard('{Control>}{Shift>}z{/Shift}{/Control}');
    expect(wayOf(way.id).device.ratingA).toBe(Number(other));

    await user.keyboard('{Control>}z{/Control}');
    expect(wayOf(way.id).device.ratingA).toBe(before);
    expect(redoButton().disabled).toBe(false);
    await user.keyboard('{Control>}y{/Control}');
    expect(wayOf(way.id).device.ratingA).toBe(Number(other));
    expect(rating.value).toBe(other);

    await user.click(undoButton());
    expect(store().past).toHaveLength(0);
    expect(store().dirty).toBe(false);
  });
});
