import { create } from 'zustand';

/** Where saving stands. `conflict`: someone else saved first; `locked`: the board may not be saved now. */
export type SavePhase = 'idle' | 'saving' | 'saved' | 'failed' | 'conflict' | 'locked';

type SaveState = {
  phase: SavePhase;
  message: string | null;
  /** The stored version when a save met a conflict ("keep mine" saves on top of it). */
  theirVersion: number | null;
  savedAt: number | null;
  set: (patch: Partial<Omit<SaveState, 'set' | 'reset'>>) => void;
  reset: () => void;
};

const initial = { phase: 'idle' as SavePhase, message: null, theirVersion: null, savedAt: null };

/** How the editor's saving is going, for the toolbar and the conflict prompt. */
export const useSaveStore = create<SaveState>()((set) => ({
  ...initial,
  set: (patch) => set(patch),
  reset: () => set({ ...initial }),
}));
