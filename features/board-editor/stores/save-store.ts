import { create } from 'zustand';
import { combine } from 'zustand/middleware';

import type { FeedChange } from '@/lib/sites/tree-types';

/**
 * Where saving stands. `conflict`: someone else saved first; `feeds`: the save would take the
 * way feeding other boards and waits for the designer; `locked`: the board may not be saved now.
 */
type SavePhase = 'idle' | 'saving' | 'saved' | 'failed' | 'conflict' | 'feeds' | 'locked';

const initial = {
  phase: 'idle' as SavePhase,
  message: null as string | null,
  /** The stored version when a save met a conflict ("keep mine" saves on top of it). */
  theirVersion: null as number | null,
  /** In `feeds`: the boards whose feeding way the save takes (they would be fed from the origin). */
  feedChanges: null as FeedChange[] | null,
  /** The designer agreed to those feed changes: the next save sends `confirmFeedChanges`. */
  confirmFeeds: false,
};

/** How the editor's saving is going, for the toolbar and the conflict prompt. */
export const useSaveStore = create(
  combine(initial, (set) => ({
    set: (patch: Partial<typeof initial>) => set(patch),
    reset: () => set({ ...initial }),
  })),
);
