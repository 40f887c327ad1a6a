import { create } from 'zustand';

import type { FeedChange } from '@/lib/sites/tree-types';

/**
 * Where saving stands. `conflict`: someone else saved first; `feeds`: the save would take the
 * way feeding other boards and waits for the designer; `locked`: the board may not be saved now.
 */
type SavePhase = 'idle' | 'saving' | 'saved' | 'failed' | 'conflict' | 'feeds' | 'locked';

type SaveState = {
  phase: SavePhase;
  message: string | null;
  /** The stored version when a save met a conflict ("keep mine" saves on top of it). */
  theirVersion: number | null;
  /** In `feeds`: the boards whose feeding way the save takes (they would be fed from the origin). */
  feedChanges: FeedChange[] | null;
  /** The designer agreed to those feed changes: the next save sends `confirmFeedChanges`. */
  confirmFeeds: boolean;
  set: (patch: Partial<Omit<SaveState, 'set' | 'reset'>>) => void;
  reset: () => void;
};

const initial = {
  phase: 'idle' as SavePhase,
  message: null,
  theirVersion: null,
  feedChanges: null,
  confirmFeeds: false,
};

/** How the editor's saving is going, for the toolbar and the conflict prompt. */
export const useSaveStore = create<SaveState>()((set) => ({
  ...initial,
  set: (patch) => set(patch),
  reset: () => set({ ...initial }),
}));
