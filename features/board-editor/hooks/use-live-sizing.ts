'use client';

import { useEffect } from 'react';

import { ApiError } from '@/lib/api/client';

import { sizeDraft } from '../api/board-editor-api';
import { useBoardDraftStore } from '../stores/board-draft-store';
import { useSizingStore } from '../stores/sizing-store';

/** Quiet time after a change before the draft is sized again, ms. */
export const SIZING_DEBOUNCE_MS = 150;

/**
 * Sizes the draft through `POST /api/boards/:id/sizing` after every change. The first change
 * after a quiet spell goes at once; a burst of changes (typing) is sent 150 ms after the last
 * one. A newer change aborts the request in flight, and an answer is shown only if it belongs
 * to a newer draft revision than the one shown. The draft stays editable all the while.
 */
export function useLiveSizing(boardId: string, enabled: boolean): void {
  useEffect(() => {
    if (!enabled) return;
    let timer: ReturnType<typeof setTimeout> | undefined;
    let controller: AbortController | null = null;
    let lastChangeAt = -Infinity;
    let disposed = false;

    async function send() {
      timer = undefined;
      const { revision, settings, ways, boardId: openId } = useBoardDraftStore.getState();
      if (!settings || openId !== boardId) return;
      controller?.abort();
      const own = new AbortController();
      controller = own;
      useSizingStore.getState().setPending(revision);
      try {
        const result = await sizeDraft(boardId, { settings, ways }, own.signal);
        if (!disposed && !own.signal.aborted) useSizingStore.getState().apply(revision, result);
      } catch (err) {
        if (disposed || own.signal.aborted || (err as Error)?.name === 'AbortError') return;
        const detail = err instanceof ApiError && err.issues.length ? ` (${err.issues[0].path}: ${err.issues[0].message})` : '';
        useSizingStore.getState().fail(revision, `${(err as Error).message}${detail}`);
      } finally {
        if (controller === own) controller = null;
      }
    }

    function schedule() {
      // A newer change makes the request in flight worthless
      controller?.abort();
      controller = null;
      const now = performance.now();
      const quiet = now - lastChangeAt >= SIZING_DEBOUNCE_MS && timer === undefined;
      lastChangeAt = now;
      if (timer !== undefined) clearTimeout(timer);
      useSizingStore.getState().setPending(useBoardDraftStore.getState().revision);
      if (quiet) void send();
      else timer = setTimeout(() => void send(), SIZING_DEBOUNCE_MS);
    }

    const unsubscribe = useBoardDraftStore.subscribe((state, previous) => {
      if (state.revision !== previous.revision) schedule();
    });
    schedule();
    return () => {
      disposed = true;
      unsubscribe();
      if (timer !== undefined) clearTimeout(timer);
      controller?.abort();
    };
  }, [boardId, enabled]);
}
