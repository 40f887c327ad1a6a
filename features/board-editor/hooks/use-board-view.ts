'use client';

import { createContext, useContext, useMemo } from 'react';

import { wayLabelMap } from '@/lib/boards/layout';

import { useBoardDraftStore } from '../stores/board-draft-store';

/** How the drawn board is shown, from the editor: its parts read it rather than taking props. */
type BoardView = {
  readOnly: boolean;
  showVerdicts: boolean;
  /** Why the device being dragged would not fit where it is, if it would not. */
  dropRefusal: string | null;
  onRemove: (id: string) => void;
};

export const BoardViewContext = createContext<BoardView>({
  readOnly: true,
  showVerdicts: false,
  dropRefusal: null,
  onRemove: () => {},
});

/** The drawn board's settings, from the nearest `DrawnBoard`. */
export const useBoardView = () => useContext(BoardViewContext);

/** Each way's reference (null for devices without one), by way id, for the draft as it is. */
export function useWayLabels(): Map<string, string | null> {
  const settings = useBoardDraftStore((s) => s.settings);
  const ways = useBoardDraftStore((s) => s.ways);
  return useMemo(
    () => (settings ? wayLabelMap(settings.phases, ways) : new Map<string, string | null>()),
    [settings, ways],
  );
}
