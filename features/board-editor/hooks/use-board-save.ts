'use client';

import { useCallback, useEffect, useRef } from 'react';

import { errorMessage } from '@/lib/api/client';
import { saveInputOf } from '@/lib/boards/schemas';
import type { BoardDto } from '@/lib/boards/types';

import { fetchBoard, saveDraft } from '../api/board-editor-api';
import { useBoardDraftStore } from '../stores/board-draft-store';
import { useSaveStore } from '../stores/save-store';
import type { EditorBoard } from '../types/draft';
import { clearStoredDraft } from './use-draft-persistence';

/** Quiet time after the last change before the draft saves itself, ms. */
export const AUTOSAVE_MS = 3000;
/** First wait before a failed save is tried again; it doubles each time, up to a minute. */
export const RETRY_FIRST_MS = 5000;

/** The editor's view of a board from the API. */
export function editorBoard(board: BoardDto): EditorBoard {
  return { id: board.id, status: board.status, ...saveInputOf(board) };
}

/**
 * Saving the draft: `save()` on demand and on its own a few seconds after the last change.
 * A save names the version the draft builds on; when someone else saved first the save store
 * goes to `conflict` and waits for the designer: `reloadTheirs()` drops this draft for the
 * stored board, `keepMine()` saves this draft on top of theirs. A failed save keeps the draft
 * (in memory and session storage), says so and is tried again on its own. Only one save runs at a time; a save asked
 * for meanwhile waits for it, then saves whatever is newer.
 */
export function useBoardSave(boardId: string, enabled: boolean) {
  const inFlight = useRef<Promise<void> | null>(null);

  const save = useCallback(async (): Promise<boolean> => {
    if (!enabled) return false;
    // One save at a time: wait for the one running, then save what is newer
    while (inFlight.current) await inFlight.current;
    const phase = useSaveStore.getState().phase;
    if (phase === 'conflict' || phase === 'locked') return false;
    const run = async () => {
      const { settings, ways, baseVersion, dirty } = useBoardDraftStore.getState();
      if (!settings || !dirty) return;
      const snapshot = { settings, ways };
      useSaveStore.getState().set({ phase: 'saving', message: null });
      try {
        const outcome = await saveDraft(boardId, baseVersion, snapshot);
        if (outcome.kind === 'saved') {
          useBoardDraftStore.getState().markSaved(outcome.board.version, snapshot, outcome.board.status);
          if (!useBoardDraftStore.getState().dirty) clearStoredDraft(boardId);
          useSaveStore.getState().set({ phase: 'saved', savedAt: Date.now(), message: null });
        } else if (outcome.kind === 'conflict') {
          useSaveStore.getState().set({ phase: 'conflict', theirVersion: outcome.theirVersion, message: outcome.message });
        } else {
          useSaveStore.getState().set({ phase: 'locked', message: outcome.message });
        }
      } catch (err) {
        useSaveStore.getState().set({
          phase: 'failed',
          message: `${errorMessage(err)} Your changes are kept in this browser.`,
        });
      }
    };
    const running = run();
    inFlight.current = running;
    try {
      await running;
    } finally {
      inFlight.current = null;
    }
    return !useBoardDraftStore.getState().dirty && useSaveStore.getState().phase !== 'failed';
  }, [boardId, enabled]);

  // Autosave a few seconds after the last change
  useEffect(() => {
    if (!enabled) return;
    let timer: ReturnType<typeof setTimeout> | undefined;
    const unsubscribe = useBoardDraftStore.subscribe((state, previous) => {
      if (state.revision === previous.revision || !state.dirty) return;
      if (timer) clearTimeout(timer);
      timer = setTimeout(() => void save(), AUTOSAVE_MS);
    });
    return () => {
      unsubscribe();
      if (timer) clearTimeout(timer);
    };
  }, [enabled, save]);

  // A failed save (server or network away) is tried again on its own, waiting longer each time
  useEffect(() => {
    if (!enabled) return;
    let attempt = 0;
    let timer: ReturnType<typeof setTimeout> | undefined;
    const unsubscribe = useSaveStore.subscribe((state, previous) => {
      if (state.phase === previous.phase) return;
      if (state.phase === 'saved') attempt = 0;
      if (state.phase !== 'failed') return;
      if (timer) clearTimeout(timer);
      timer = setTimeout(() => void save(), Math.min(RETRY_FIRST_MS * 2 ** attempt, 60_000));
      attempt += 1;
    });
    return () => {
      unsubscribe();
      if (timer) clearTimeout(timer);
    };
  }, [enabled, save]);

  /** Drops this draft and opens the board as stored now. */
  const reloadTheirs = useCallback(async () => {
    try {
      const board = await fetchBoard(boardId);
      clearStoredDraft(boardId);
      useBoardDraftStore.getState().load(editorBoard(board));
      useSaveStore.getState().reset();
    } catch (err) {
      useSaveStore.getState().set({ message: errorMessage(err) });
    }
  }, [boardId]);

  /** Saves this draft on top of the version someone else saved. */
  const keepMine = useCallback(async () => {
    const theirs = useSaveStore.getState().theirVersion;
    if (theirs === null) return;
    useBoardDraftStore.getState().rebase(theirs);
    useSaveStore.getState().set({ phase: 'idle', theirVersion: null, message: null });
    await save();
  }, [save]);

  return { save, reloadTheirs, keepMine };
}
