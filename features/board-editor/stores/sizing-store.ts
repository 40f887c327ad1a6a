import { create } from 'zustand';

import type { BoardResult, WayResult } from '@/lib/sizing';

type SizingState = {
  result: BoardResult | null;
  /** The draft revision the shown result was computed for (0: none yet). */
  forRevision: number;
  /** The draft revision being sized now, or null when nothing is waiting. */
  pendingRevision: number | null;
  error: string | null;
  byId: Map<string, WayResult>;
  /** Shows `result` for `revision` unless a newer revision is already shown. */
  apply: (revision: number, result: BoardResult) => void;
  setPending: (revision: number | null) => void;
  fail: (revision: number, message: string) => void;
  reset: () => void;
};

const initial = {
  result: null,
  forRevision: 0,
  pendingRevision: null,
  error: null,
  byId: new Map<string, WayResult>(),
};

/**
 * The live sizing of the draft: the last answer of the sizing route and the draft revision it
 * belongs to. An answer for an older revision than the one shown is dropped, so a slow, stale
 * answer never replaces a newer one.
 */
export const useSizingStore = create<SizingState>()((set, get) => ({
  ...initial,
  apply: (revision, result) => {
    if (revision < get().forRevision) return;
    const pending = get().pendingRevision;
    set({
      result,
      forRevision: revision,
      byId: new Map(result.ways.map((w) => [w.id, w])),
      error: null,
      pendingRevision: pending !== null && pending > revision ? pending : null,
    });
  },
  setPending: (revision) => set({ pendingRevision: revision }),
  fail: (revision, message) => {
    if (revision < get().forRevision) return;
    set({ error: message, pendingRevision: null });
  },
  reset: () => set({ ...initial, byId: new Map() }),
}));
