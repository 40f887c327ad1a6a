'use client';

import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { createContext, useContext, useEffect, useMemo, useRef, useState } from 'react';

import { ApiError } from '@/lib/api/client';
import type { BoardResult } from '@/lib/sizing';

import { sizeDraft } from '../api/board-editor-api';
import { useBoardDraftStore } from '../stores/board-draft-store';

/** Quiet time after a change before the draft is sized again, when changes come quickly, ms. */
export const SIZING_DEBOUNCE_MS = 150;

/** The sizing of the draft at one edit sequence. */
export type DraftSizing = { editSeq: number; result: BoardResult };

/** The query key of the draft's sizing at an edit sequence. */
export const sizingKey = (boardId: string, editSeq: number) => ['board-sizing', boardId, editSeq] as const;

/**
 * The draft's sizing as a query keyed by the edit sequence: `POST /api/boards/:id/sizing` with
 * the draft as it is when the request goes. A newer key leaves the request in flight without
 * observers, and the query's signal aborts it; until the newer answer comes the last one stays
 * shown (`placeholderData`). An answer never goes stale: a change is a new key.
 */
function sizingQuery(boardId: string, editSeq: number, enabled: boolean) {
  return queryOptions({
    queryKey: sizingKey(boardId, editSeq),
    queryFn: async ({ signal }): Promise<DraftSizing> => {
      const { settings, ways, editSeq: current } = useBoardDraftStore.getState();
      const result = await sizeDraft(boardId, { settings: settings!, ways }, signal);
      return { editSeq: current, result };
    },
    enabled,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
    gcTime: 5_000,
    retry: false,
  });
}

/**
 * The edit sequence to size: at once after a quiet spell, else once changes have stopped
 * coming for `SIZING_DEBOUNCE_MS` (a burst of typing is sized once).
 */
function useSettledEditSeq(editSeq: number): number {
  const [settled, setSettled] = useState(editSeq);
  const lastChange = useRef(-Infinity);
  useEffect(() => {
    const now = performance.now();
    const quiet = now - lastChange.current >= SIZING_DEBOUNCE_MS;
    lastChange.current = now;
    if (quiet) return setSettled(editSeq);
    const timer = setTimeout(() => setSettled(editSeq), SIZING_DEBOUNCE_MS);
    return () => clearTimeout(timer);
  }, [editSeq]);
  return settled;
}

type LiveSizingState = {
  boardId: string;
  editSeq: number;
  enabled: boolean;
  /** The result shown is not for the draft as it is now (a sizing is on its way). */
  pending: boolean;
  /** Why the last sizing failed, in words. */
  error: string | null;
};

const LiveSizingContext = createContext<LiveSizingState>({ boardId: '', editSeq: 0, enabled: false, pending: false, error: null });

/**
 * Sizes the open draft after every change (`enabled`: the member may see sizing) and gives the
 * components inside it the answer through `useDraftSizing`. The draft stays editable all the while.
 */
export function LiveSizing({ boardId, enabled, children }: { boardId: string; enabled: boolean; children: React.ReactNode }) {
  const editSeq = useBoardDraftStore((s) => s.editSeq);
  const open = useBoardDraftStore((s) => s.boardId === boardId && s.settings !== null);
  const settled = useSettledEditSeq(editSeq);
  const query = useQuery(sizingQuery(boardId, settled, enabled && open));
  const pending = enabled && !query.isError && query.data?.editSeq !== editSeq;
  const error = query.error ? failureWords(query.error) : null;
  const value = useMemo(
    () => ({ boardId, editSeq: settled, enabled: enabled && open, pending, error }),
    [boardId, settled, enabled, open, pending, error],
  );
  return <LiveSizingContext.Provider value={value}>{children}</LiveSizingContext.Provider>;
}

function failureWords(err: Error): string {
  const detail = err instanceof ApiError && err.issues.length ? ` (${err.issues[0].path}: ${err.issues[0].message})` : '';
  return `${err.message}${detail}`;
}

/** Whether a sizing is on its way, and why the last one failed. */
export function useSizingState(): Pick<LiveSizingState, 'pending' | 'error'> {
  const { pending, error } = useContext(LiveSizingContext);
  return { pending, error };
}

/**
 * The part of the draft's last sizing that `select` picks (undefined before the first answer).
 * A component re-renders only when its part changes.
 */
export function useDraftSizing<T>(select: (sizing: DraftSizing) => T): T | undefined {
  const { boardId, editSeq, enabled } = useContext(LiveSizingContext);
  return useQuery({ ...sizingQuery(boardId, editSeq, enabled), select }).data;
}
