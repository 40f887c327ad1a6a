import { beforeEach, describe, expect, it } from 'vitest';

import { useBoardDraftStore, UNDO_LIMIT } from '@/features/board-editor/stores/board-draft-store';
import { deviceFromChoice } from '@/features/board-editor/utils/device-catalogue';
import { layoutWays } from '@/lib/boards/layout';
import { rcdGroups } from '@/lib/boards/rail';

import { demoBoard } from './fixtures';

const store = () => useBoardDraftStore.getState();
const mcb = (ratingA = 16, poles: 1 | 3 = 1) => deviceFromChoice('mcb', { poles, curve: 'B', ratingA });
let nextId = 0;
const id = () => `00000000-0000-4000-8000-${String(++nextId).padStart(12, '0')}`;

beforeEach(() => {
  store().reset();
});

describe('the board draft store', () => {
  it('opens a board clean, with nothing to undo', () => {
    const board = demoBoard('flat');
    store().load(board);
    expect(store().boardId).toBe(board.id);
    expect(store().ways).toHaveLength(board.ways.length);
    expect(store().dirty).toBe(false);
    expect(store().past).toHaveLength(0);
  });

  it('a way dropped back where it was is no edit; dropped one place on, it is one undo step', () => {
    store().load(demoBoard('flat'));
    const [, second] = store().ways;
    const before = store().ways;
    expect(store().moveWay(second.id, second.rail, 1)).toEqual({ ok: true });
    expect(store().ways).toBe(before);
    expect(store().past).toHaveLength(0);
    expect(store().dirty).toBe(false);
    store().moveWay(second.id, second.rail, 2);
    expect(store().ways).not.toBe(before);
    expect(store().past).toHaveLength(1);
  });

  it('undo and redo step through changes, and the dirty flag follows the saved copy', () => {
    store().load(demoBoard('flat'));
    const before = store().ways;
    const first = store().ways.find((w) => w.circuit)!;
    store().updateCircuit(first.id, { ...first.circuit!, lengthM: 40 });
    store().removeWay(store().ways[store().ways.length - 1].id);
    expect(store().dirty).toBe(true);
    expect(store().ways).toHaveLength(before.length - 1);

    store().undo();
    expect(store().ways).toHaveLength(before.length);
    expect(store().ways.find((w) => w.id === first.id)!.circuit!.lengthM).toBe(40);
    store().undo();
    // Back to the loaded ways: the very same draft, so no longer dirty
    expect(store().ways).toBe(before);
    expect(store().dirty).toBe(false);
    store().undo();
    expect(store().ways).toBe(before);

    store().redo();
    expect(store().ways.find((w) => w.id === first.id)!.circuit!.lengthM).toBe(40);
    expect(store().dirty).toBe(true);
    store().redo();
    expect(store().ways).toHaveLength(before.length - 1);
    // A new change after an undo drops the redo steps
    store().undo();
    store().updateCircuit(first.id, { ...first.circuit!, lengthM: 12 });
    expect(store().future).toHaveLength(0);
  });

  it(`keeps at least 50 undo steps (${UNDO_LIMIT})`, () => {
    store().load(demoBoard('flat'));
    const way = store().ways.find((w) => w.circuit)!;
    for (let i = 1; i <= 60; i++) store().updateCircuit(way.id, { ...way.circuit!, lengthM: i });
    for (let i = 0; i < 59; i++) store().undo();
    expect(store().ways.find((w) => w.id === way.id)!.circuit!.lengthM).toBe(1);
    store().undo();
    expect(store().ways.find((w) => w.id === way.id)!.circuit!.lengthM).toBe(way.circuit!.lengthM);
  });

  it('typing in one field is one undo step; another field starts a new one', () => {
    store().load(demoBoard('flat'));
    const way = store().ways.find((w) => w.circuit)!;
    store().updateCircuit(way.id, { ...way.circuit!, lengthM: 2 }, 'len');
    store().updateCircuit(way.id, { ...way.circuit!, lengthM: 25 }, 'len');
    store().updateCircuit(way.id, { ...way.circuit!, lengthM: 25, ambientC: 35 }, 'amb');
    expect(store().past).toHaveLength(2);
    store().undo();
    expect(store().ways.find((w) => w.id === way.id)!.circuit!.lengthM).toBe(25);
    store().undo();
    expect(store().ways.find((w) => w.id === way.id)!.circuit!.lengthM).toBe(way.circuit!.lengthM);
  });

  it('writing a value the draft already holds is no edit: no undo step, redo kept, edit sequence unmoved', () => {
    store().load(demoBoard('flat'));
    const way = store().ways.find((w) => w.circuit)!;
    store().updateCircuit(way.id, { ...way.circuit!, lengthM: 44 });
    store().undo();
    const seq = store().editSeq;
    // The same circuit with its keys in another order and an absent optional field as undefined
    const reordered = Object.fromEntries(Object.entries(way.circuit!).reverse());
    store().updateCircuit(way.id, { ...reordered, notAField: undefined } as never);
    store().updateDevice(way.id, { ...way.device });
    expect(store().future).toHaveLength(1);
    expect(store().past).toHaveLength(0);
    expect(store().editSeq).toBe(seq);
    expect(store().dirty).toBe(false);
    store().redo();
    expect(store().ways.find((w) => w.id === way.id)!.circuit!.lengthM).toBe(44);
  });

  it('keeps a form’s unfinished input outside the draft; a valid value or an undo of that way drops it', () => {
    store().load(demoBoard('flat'));
    const [a, b] = store().ways.filter((w) => w.circuit);
    store().keepUnfinished(`circuit:${a.id}`, { lengthM: '' });
    store().keepUnfinished(`circuit:${b.id}`, { lengthM: '' });
    expect(store().past).toHaveLength(0);
    expect(store().dirty).toBe(false);
    store().updateCircuit(a.id, { ...a.circuit!, lengthM: 13 });
    expect(store().unfinished).toEqual({ [`circuit:${b.id}`]: { lengthM: '' } });
    store().keepUnfinished(`circuit:${a.id}`, { lengthM: 'x' });
    // Undo changes way a's circuit back: its unfinished input goes, way b's stays
    store().undo();
    expect(Object.keys(store().unfinished)).toEqual([`circuit:${b.id}`]);
  });

  it('the edit sequence goes up with every change and carries on over a reset', () => {
    store().load(demoBoard('flat'));
    const first = store().editSeq;
    store().removeWay(store().ways[0].id);
    expect(store().editSeq).toBe(first + 1);
    store().undo();
    expect(store().editSeq).toBe(first + 2);
    store().reset();
    store().load(demoBoard('flat'));
    expect(store().editSeq).toBe(first + 3);
  });

  it('adds a device that fits and selects it', () => {
    store().load(demoBoard('flat'));
    const newId = id();
    const result = store().addDevice(newId, mcb(), 0, 2);
    expect(result).toEqual({ ok: true });
    expect(store().ways[2].id).toBe(newId);
    expect(store().ways.map((w) => w.position)).toEqual(store().ways.map((_, i) => i));
    expect(store().selection).toEqual([newId]);
  });

  it('refuses a device wider than the free modules, with the reason, and changes nothing', () => {
    // Flat board: 15 of 18 modules used, 3 free. A 4-pole device is refused on width alone
    // only on a three-phase board, so fill the rail first: two 1-module MCBs leave 1 free.
    store().load(demoBoard('flat'));
    store().addDevice(id(), mcb(), 0, 99);
    store().addDevice(id(), mcb(), 0, 99);
    const ways = store().ways;
    const rcd = deviceFromChoice('rcd', { poles: 2, ratingA: 63, rcdMa: 30, rcdType: 'A' });
    const result = store().addDevice(id(), rcd, 0, 4);
    expect(result).toEqual({ ok: false, reason: 'Too few free modules on rail 1: the RCD needs 2 and 1 is free.' });
    expect(store().ways).toBe(ways);
    expect(store().notice?.message).toBe(result.ok ? '' : result.reason);
  });

  it('refuses a three-pole device on a single-phase board', () => {
    store().load(demoBoard('flat'));
    const result = store().addDevice(id(), mcb(20, 3), 0, 3);
    expect(result.ok).toBe(false);
    expect(!result.ok && result.reason).toMatch(/3-pole MCB needs a three-phase supply; this board is single-phase/);
    expect(store().past).toHaveLength(0);
  });

  it('RCD coverage follows moves: an MCB moved behind an RCD is protected by it, and undo restores', () => {
    store().load(demoBoard('flat'));
    const [rcd1, rcd2] = store().ways.filter((w) => w.device.kind === 'rcd');
    const covered = () => new Map(rcdGroups(store().ways).map((g) => [g.rcdId, g.protectedIds]));
    const cooker = store().ways.find((w) => w.circuit?.serves?.startsWith('Cooker'))!;
    expect(covered().get(rcd2.id)).toContain(cooker.id);

    // Move the cooker way in front of the first RCD: between the main switch and the RCD
    const ok = store().moveWay(cooker.id, 0, 1);
    expect(ok).toEqual({ ok: true });
    expect(covered().get(rcd2.id)).not.toContain(cooker.id);
    expect(covered().get(rcd1.id)).not.toContain(cooker.id);

    // Removing the first RCD leaves its ways uncovered (the main switch ends the run)
    store().removeWay(rcd1.id);
    expect(covered().has(rcd1.id)).toBe(false);
    store().undo();
    store().undo();
    expect(covered().get(rcd2.id)).toContain(cooker.id);
  });

  it('moving onto the same place is not an undo step; a real move renumbers the ways', () => {
    store().load(demoBoard('flat'));
    const third = store().ways[2];
    store().moveWay(third.id, 0, 2);
    expect(store().past).toHaveLength(0);
    store().moveWay(third.id, 0, 3);
    const labels = layoutWays(1, store().ways).map((p) => [p.id, p.label]);
    expect(labels[3]).toEqual([third.id, '2']);
  });

  it('marks a saved draft clean, and a change made after the snapshot keeps it dirty', () => {
    store().load(demoBoard('flat'));
    store().removeWay(store().ways[3].id);
    const snapshot = { settings: store().settings!, ways: store().ways };
    store().removeWay(store().ways[3].id);
    store().markSaved(4, snapshot);
    expect(store().baseVersion).toBe(4);
    expect(store().dirty).toBe(true);
    store().undo();
    expect(store().dirty).toBe(false);
  });

  it('changing the rails flows the devices over them, and refuses when they would not fit', () => {
    store().load(demoBoard('workshop'));
    // 36 modules as two rails of 18: the 28 modules of devices fill rail 1, the rest go to rail 2
    expect(store().setRails(2)).toEqual({ ok: true });
    const onRail = (r: number) => store().ways.filter((w) => w.rail === r);
    expect(onRail(0).length).toBeGreaterThan(0);
    expect(onRail(1).length).toBeGreaterThan(0);
    const used = (r: number) => onRail(r).reduce((n, w) => n + w.device.modules, 0);
    expect(used(0)).toBeLessThanOrEqual(18);
    expect(used(1)).toBeLessThanOrEqual(18);
    // Rail order is kept: the last way on rail 1 comes before the first on rail 2
    const order = store().ways.map((w) => w.id);
    store().undo();
    expect(store().settings!.rails).toBe(1);
    expect(store().ways.map((w) => w.id)).toEqual(order);
    // Twelve rails of 3 modules cannot take a 4-module main switch
    const result = store().setRails(12);
    expect(result.ok).toBe(false);
    expect(store().settings!.rails).toBe(1);
  });

  it('reset clears everything between tests', () => {
    store().load(demoBoard('flat'));
    store().removeWay(store().ways[0].id);
    store().reset();
    expect(store().boardId).toBeNull();
    expect(store().ways).toEqual([]);
    expect(store().past).toEqual([]);
  });
});
