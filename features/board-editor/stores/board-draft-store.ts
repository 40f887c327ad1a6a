import { create } from 'zustand';
import { combine } from 'zustand/middleware';

import { normalisePositions, placementProblem, placeWay, railCapacities, reflowWays } from '@/lib/boards/rail';
import type { BoardSettings } from '@/lib/boards/schemas';
import type { CircuitSpec, DeviceOnRail } from '@/lib/sizing';
import type { BoardStatus } from '@/lib/domain';

import type { DraftSnapshot, EditorBoard, EditorWay, EditResult } from '../types/draft';

/** How many steps undo keeps (the issue asks for at least 50). */
export const UNDO_LIMIT = 100;

const initial = {
  boardId: null as string | null,
  settings: null as BoardSettings | null,
  ways: [] as EditorWay[],
  status: 'draft' as BoardStatus,
  /** The stored version the draft builds on; a save names it. */
  baseVersion: 0,
  /** The edit sequence: goes up on every change to the draft (edit, undo, redo, load); live sizing keys on it. */
  editSeq: 0,
  /** The draft as last saved (or loaded); compared by reference for the dirty flag. */
  saved: null as DraftSnapshot | null,
  dirty: false,
  past: [] as DraftSnapshot[],
  future: [] as DraftSnapshot[],
  /** Edits with the same key in a row merge into one undo step (typing in one field). */
  lastKey: null as string | null,
  selection: [] as string[],
  /** A refusal the editor shows (and reads out) once. */
  notice: null as { message: string } | null,
  /**
   * What a way's form holds while it is not valid yet, by form and way (`circuit:<id>`), so
   * that it survives selecting another way. Not part of the draft: no undo step, no save.
   */
  unfinished: {} as Record<string, unknown>,
};

type State = typeof initial;

/**
 * Whether two plain JSON-like values are the same: objects compared key by key in any order
 * (a stored board's jsonb keeps keys in its own order), a key holding `undefined` counted as
 * absent (a form's empty optional field).
 */
function sameValue(a: unknown, b: unknown): boolean {
  if (Object.is(a, b)) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  const keys = (o: object) => Object.entries(o).filter(([, v]) => v !== undefined);
  const left = keys(a);
  const right = new Map(keys(b));
  return left.length === right.size && left.every(([k, v]) => right.has(k) && sameValue(v, right.get(k)));
}

const isSaved = (saved: DraftSnapshot | null, settings: BoardSettings | null, ways: EditorWay[]) =>
  !!saved && saved.settings === settings && saved.ways === ways;

const without = (record: Record<string, unknown>, key: string) =>
  key in record ? Object.fromEntries(Object.entries(record).filter(([k]) => k !== key)) : record;

/** The kept input of the ways whose device or circuit `ways` changed is dropped: the change wins. */
function keptFor(state: State, ways: EditorWay[]): Record<string, unknown> {
  const before = new Map(state.ways.map((w) => [w.id, w]));
  const after = new Map(ways.map((w) => [w.id, w]));
  return Object.fromEntries(
    Object.entries(state.unfinished).filter(([key]) => {
      const [form, id] = key.split(':') as ['circuit' | 'device', string];
      return before.get(id)?.[form] === after.get(id)?.[form];
    }),
  );
}

const present = (state: State): DraftSnapshot => ({ settings: state.settings!, ways: state.ways });

/** The part of the state undo or redo sets: the draft at `to`, the history as given, the selection kept where it can. */
function travel(state: State, to: DraftSnapshot, past: DraftSnapshot[], future: DraftSnapshot[]): Partial<State> {
  const ids = new Set(to.ways.map((w) => w.id));
  return {
    settings: to.settings,
    ways: to.ways,
    past,
    future,
    lastKey: null,
    editSeq: state.editSeq + 1,
    unfinished: keptFor(state, to.ways),
    dirty: !isSaved(state.saved, to.settings, to.ways),
    selection: state.selection.filter((id) => ids.has(id)),
  };
}

/** The part of the state a change sets: a new snapshot, one undo step (or merged), dirty. */
function commit(state: State, next: Partial<DraftSnapshot>, key: string | null = null): Partial<State> {
  const settings = next.settings ?? state.settings;
  const ways = next.ways ?? state.ways;
  const merge = key !== null && key === state.lastKey && state.past.length > 0;
  const past = merge ? state.past : [...state.past, present(state)].slice(-UNDO_LIMIT);
  return {
    settings,
    ways,
    past,
    future: [],
    lastKey: key,
    editSeq: state.editSeq + 1,
    dirty: !isSaved(state.saved, settings, ways),
  };
}

/** Refuses an edit: the reason is shown (and read out), and answered. */
function refuse(set: (partial: Partial<State>) => void, reason: string): EditResult {
  set({ notice: { message: reason } });
  return { ok: false, reason };
}

/** A way's circuit or device set to `value` (its kept form input dropped). */
function setWayPart<K extends 'circuit' | 'device'>(
  state: State,
  way: EditorWay,
  part: K,
  value: EditorWay[K],
  key: string | undefined,
): Partial<State> {
  const unfinished = without(state.unfinished, `${part}:${way.id}`);
  // The same value again (a form showing an undo): no edit, so the redo stack stays
  if (sameValue(way[part], value)) return { unfinished };
  const ways = state.ways.map((w) => (w.id === way.id ? { ...w, [part]: value } : w));
  return { ...commit(state, { ways }, key ?? null), unfinished };
}

/**
 * The board editor's draft: settings and ways, the selection, undo and redo, and whether the
 * draft differs from what was last saved. Pure state: no fetches, timers or storage here;
 * hooks (live sizing, saving, session storage) watch it.
 */
export const useBoardDraftStore = create(
  combine(initial, (set, get) => ({
    /** Opens a board; `draft` restores unsaved work kept from an earlier visit. */
    load: (board: EditorBoard, draft?: DraftSnapshot) => {
      const saved = { settings: board.settings, ways: normalisePositions(board.ways) };
      const current = draft ? { settings: draft.settings, ways: normalisePositions(draft.ways) } : saved;
      set({
        ...initial,
        boardId: board.id,
        status: board.status,
        baseVersion: board.version,
        settings: current.settings,
        ways: current.ways,
        saved,
        dirty: !!draft,
        editSeq: get().editSeq + 1,
      });
    },

    /** Puts a new device (with the id the caller made) at an index of a rail. */
    addDevice: (id: string, device: DeviceOnRail, rail: number, index: number): EditResult => {
      const state = get();
      if (!state.settings) return { ok: false, reason: 'No board is open.' };
      const way: EditorWay = { id, rail, position: index, device, circuit: null };
      const problem = placementProblem(state.settings, state.ways, way, rail, index);
      if (problem) return refuse(set, problem);
      set({ ...commit(state, { ways: placeWay(state.ways, way, rail, index) }), selection: [id], notice: null });
      return { ok: true };
    },

    /** Moves a way to an index of a rail (the index counts the rail's ways without it). */
    moveWay: (id: string, rail: number, index: number): EditResult => {
      const state = get();
      const way = state.ways.find((w) => w.id === id);
      if (!state.settings || !way) return { ok: false, reason: 'That way is no longer on the board.' };
      const problem = placementProblem(state.settings, state.ways, way, rail, index);
      if (problem) return refuse(set, problem);
      const ways = placeWay(state.ways, way, rail, index);
      // Dropped back where it was: no undo step (both lists are in rail order)
      if (sameValue(ways, state.ways)) return { ok: true };
      set({ ...commit(state, { ways }), notice: null });
      return { ok: true };
    },

    removeWay: (id: string) => {
      const state = get();
      if (!state.ways.some((w) => w.id === id)) return;
      const ways = normalisePositions(state.ways.filter((w) => w.id !== id));
      set({ ...commit(state, { ways }), selection: state.selection.filter((s) => s !== id) });
    },

    /** Sets a way's circuit (null: a spare way). `key` merges a run of edits into one undo step. */
    updateCircuit: (id: string, circuit: CircuitSpec | null, key?: string) => {
      const way = get().ways.find((w) => w.id === id);
      if (way) set(setWayPart(get(), way, 'circuit', circuit, key));
    },

    /** Changes a way's device details (not its width: that is a new device). */
    updateDevice: (id: string, device: DeviceOnRail, key?: string): EditResult => {
      const state = get();
      const way = state.ways.find((w) => w.id === id);
      if (!way) return { ok: false, reason: 'That way is no longer on the board.' };
      if (device.modules !== way.device.modules || device.kind !== way.device.kind) {
        return refuse(set, 'A different kind or width of device is a new device: drag it from the tray.');
      }
      set(setWayPart(state, way, 'device', device, key));
      return { ok: true };
    },

    /** Sets how many rails the enclosure has; refused if the ways would not fit. */
    setRails: (rails: number): EditResult => {
      const state = get();
      if (!state.settings) return { ok: false, reason: 'No board is open.' };
      if (rails < 1 || rails > 12) return { ok: false, reason: 'A board has between 1 and 12 rails.' };
      const settings = { ...state.settings, rails };
      // The devices flow over the new rails in their order, each rail filled from the left
      const capacities = railCapacities(settings.enclosureModules, rails);
      const { ways, fits } = reflowWays(settings.phases, capacities, state.ways);
      if (!fits) {
        const reason = `The devices do not fit on ${rails} rail${rails === 1 ? '' : 's'} of ${capacities[0]} modules: remove some first.`;
        return refuse(set, reason);
      }
      set({ ...commit(state, { settings, ways }), notice: null });
      return { ok: true };
    },

    select: (id: string | null) => set({ selection: id ? [id] : [] }),
    selectMany: (ids: string[]) => set({ selection: ids }),

    undo: () => {
      const state = get();
      const previous = state.past[state.past.length - 1];
      if (!previous) return;
      set(travel(state, previous, state.past.slice(0, -1), [present(state), ...state.future]));
    },

    redo: () => {
      const state = get();
      const next = state.future[0];
      if (!next) return;
      set(travel(state, next, [...state.past, present(state)].slice(-UNDO_LIMIT), state.future.slice(1)));
    },

    /** The draft `snapshot` was saved and the board is now at `version`. */
    markSaved: (version: number, snapshot: DraftSnapshot, status?: BoardStatus) => {
      const state = get();
      set({
        baseVersion: version,
        saved: snapshot,
        dirty: !isSaved(snapshot, state.settings, state.ways),
        // The next edit starts a new undo step rather than merging into a saved one
        lastKey: null,
        ...(status ? { status } : {}),
      });
    },

    /** Keep this draft but build on `version` (after a conflict: "keep mine"). */
    rebase: (version: number) => set({ baseVersion: version }),
    clearNotice: () => set({ notice: null }),
    /** Keeps (or, with null, drops) a form's input that is not valid yet. */
    keepUnfinished: (key: string, values: unknown) =>
      set((state) => ({
        unfinished: values === null ? without(state.unfinished, key) : { ...state.unfinished, [key]: values },
      })),
    // The edit sequence carries on: a sizing kept for an earlier opening never passes for this one
    reset: () => set({ ...initial, editSeq: get().editSeq }),
  })),
);
