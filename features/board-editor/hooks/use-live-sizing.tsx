'use client';

import { keepPreviousData, queryOptions, replaceEqualDeep, useQuery, useQueryClient } from '@tanstack/react-query';
import { createContext, useContext, useEffect, useLayoutEffect, useState } from 'react';
import { createStore, useStore, type StoreApi } from 'zustand';
import { useShallow } from 'zustand/react/shallow';

import { ApiError } from '@/lib/api/client';
import type { BoardResult } from '@/lib/sizing';

import { sizeDraft } from '../api/board-editor-api';
import { useBoardDraftStore } from '../stores/board-draft-store';

/** Quiet time after a change before the draft is sized again, when changes come quickly, ms. */
const SIZING_DEBOUNCE_MS = 80;

/** The sizing of the draft at one edit sequence. */
type DraftSizing = { editSeq: number; result: BoardResult };

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
 * coming for `SIZING_DEBOUNCE_MS` (a burst of typing is sized once). Decided as the store
 * changes, not after a render, and the request goes out at that moment (`prefetchQuery`): the
 * components showing the sizing attach to it as they render the change.
 */
function useSettledEditSeq(boardId: string, enabled: boolean): number {
  const queryClient = useQueryClient();
  const [settled, setSettled] = useState(() => useBoardDraftStore.getState().editSeq);
  useEffect(() => {
    let lastChange = -Infinity;
    let timer: ReturnType<typeof setTimeout> | undefined;
    const settle = (editSeq: number) => {
      if (enabled) void queryClient.prefetchQuery(sizingQuery(boardId, editSeq, true));
      setSettled(editSeq);
    };
    const unsubscribe = useBoardDraftStore.subscribe(({ editSeq }, previous) => {
      if (editSeq === previous.editSeq) return;
      const now = performance.now();
      const quiet = now - lastChange >= SIZING_DEBOUNCE_MS;
      lastChange = now;
      clearTimeout(timer);
      if (quiet) settle(editSeq);
      else timer = setTimeout(() => settle(useBoardDraftStore.getState().editSeq), SIZING_DEBOUNCE_MS);
    });
    return () => {
      unsubscribe();
      clearTimeout(timer);
    };
  }, [boardId, enabled, queryClient]);
  return settled;
}

type SizingState = {
  /** The result shown is not for the draft as it is now (a sizing is on its way). */
  pending: boolean;
  /** Why the last sizing failed, in words. */
  error: string | null;
};
/** What the components read: the last sizing shown, and its state. */
type Published = SizingState & { sizing: DraftSizing | undefined };

/*
 * One query observer, in `LiveSizing`, publishes the sizing through a small store; the
 * components read slices of it with selectors. (An observer per device cell, each switched to
 * the new key on every change and notified on every answer, re-rendered the whole board twice
 * per change and made the change-to-verdict time about twice as long.) An answer is merged
 * into the last one (`replaceEqualDeep`), so a way whose result did not change keeps its object.
 */
const SizingStoreContext = createContext<StoreApi<Published>>(
  createStore<Published>()(() => ({ sizing: undefined, pending: false, error: null })),
);

type LiveSizingProps = { boardId: string; enabled: boolean; children: React.ReactNode };

/**
 * Sizes the open draft after every change (`enabled`: the member may see sizing) and gives the
 * components inside it the answer through `useDraftSizing`. The draft stays editable all the while.
 */
export function LiveSizing({ boardId, enabled, children }: LiveSizingProps) {
  const editSeq = useBoardDraftStore((s) => s.editSeq);
  const open = useBoardDraftStore((s) => s.boardId === boardId && s.settings !== null);
  const settled = useSettledEditSeq(boardId, enabled && open);
  const query = useQuery(sizingQuery(boardId, settled, enabled && open));
  const sizing = query.data;
  const pending = enabled && !query.isError && sizing?.editSeq !== editSeq;
  const error = query.error ? failureWords(query.error) : null;
  const [store] = useState(() => createStore<Published>()(() => ({ sizing, pending, error })));
  // The answer for the draft as it is goes to the components in the task it arrives in (the
  // query cache tells its listeners at once; the query observer above hears a task later, then
  // renders, then publishes below: the same state, so nothing is drawn twice)
  const queryClient = useQueryClient();
  useEffect(
    () =>
      queryClient.getQueryCache().subscribe((event) => {
        if (event.type !== 'updated' || event.action.type !== 'success') return;
        const [name, id] = event.query.queryKey as unknown[];
        const answer = event.query.state.data as DraftSizing | undefined;
        if (name !== 'board-sizing' || id !== boardId || answer?.editSeq !== useBoardDraftStore.getState().editSeq)
          return;
        store.setState((last) => ({ sizing: replaceEqualDeep(last.sizing, answer), pending: false, error: null }));
      }),
    [queryClient, boardId, store],
  );
  // Before paint: the components showing the sizing re-render in the same frame, and only
  // those whose slice changed (the children themselves are not re-rendered by this component)
  useLayoutEffect(() => {
    store.setState((last) => ({ sizing: replaceEqualDeep(last.sizing, sizing), pending, error }));
  }, [store, sizing, pending, error]);
  return <SizingStoreContext.Provider value={store}>{children}</SizingStoreContext.Provider>;
}

function failureWords(err: Error): string {
  const detail =
    err instanceof ApiError && err.issues.length ? ` (${err.issues[0].path}: ${err.issues[0].message})` : '';
  return `${err.message}${detail}`;
}

/** Whether a sizing is on its way, and why the last one failed. */
export function useSizingState(): SizingState {
  const store = useContext(SizingStoreContext);
  return useStore(
    store,
    useShallow((s) => ({ pending: s.pending, error: s.error })),
  );
}

/** Why the last sizing failed, in words (null when it did not). */
export function useSizingError(): string | null {
  return useStore(useContext(SizingStoreContext), (s) => s.error);
}

/**
 * The part of the draft's last sizing that `select` picks (undefined before the first answer).
 * A component re-renders only when its part changes (compared shallowly).
 */
export function useDraftSizing<T>(select: (sizing: DraftSizing) => T): T | undefined {
  const store = useContext(SizingStoreContext);
  return useStore(
    store,
    useShallow((s) => (s.sizing ? select(s.sizing) : undefined)),
  );
}
