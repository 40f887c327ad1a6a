'use client';

import { useMutation } from '@tanstack/react-query';
import { useCallback, useEffect } from 'react';

import { ApiError, errorMessage } from '@/lib/api/client';

import { fetchBoard, saveDraft } from '../api/board-editor-api';
import { useBoardDraftStore } from '../stores/board-draft-store';
import { useSaveStore } from '../stores/save-store';
import { editorBoard } from '../utils/board-shape';
import { clearStoredDraft } from './use-draft-persistence';

/** Quiet time after the last change before the draft saves itself, ms. */
export const AUTOSAVE_MS = 3000;
/** First wait before a failed save is tried again; it doubles each time, up to a minute. */
const RETRY_FIRST_MS = 5000;

/** A failure that may pass on its own: the server not reached, or not able to answer just now. */
const passing = (err: unknown) =>
  err instanceof ApiError && (err.status === 0 || err.status === 408 || err.status === 429 || err.status >= 500);

/**
 * One attempt at saving the draft as it is now, at the version it builds on; `settle` hears
 * whether it ended saved. It says how it went in the save store and throws what may be tried again.
 */
async function saveAttempt(boardId: string, settle: (saved: boolean) => void): Promise<void> {
  const { settings, ways, baseVersion, dirty } = useBoardDraftStore.getState();
  // The save store's `set` is one function for the store's life
  const { phase, confirmFeeds, set: tell } = useSaveStore.getState();
  if (!settings || !dirty || phase === 'conflict' || phase === 'feeds' || phase === 'locked') return settle(!dirty);
  const snapshot = { settings, ways };
  tell({ phase: 'saving', message: null, confirmFeeds: false });
  try {
    const outcome = await saveDraft(boardId, baseVersion, snapshot, confirmFeeds);
    if (outcome.phase !== 'saved') {
      tell(outcome);
      return settle(false);
    }
    useBoardDraftStore.getState().markSaved(outcome.board.version, snapshot, outcome.board.status);
    if (!useBoardDraftStore.getState().dirty) clearStoredDraft(boardId);
    tell({ phase: 'saved', message: null });
    settle(!useBoardDraftStore.getState().dirty);
  } catch (err) {
    tell({ phase: 'failed', message: `${errorMessage(err)} Your changes are kept in this browser.` });
    settle(false);
    throw err;
  }
}

/**
 * Saving the draft, as a mutation: `save()` on demand and on its own a few seconds after the
 * last change. Saves of a board run one at a time in order (the mutation's scope), each saving
 * the draft as it is when it runs. A stale version waits in `conflict` (`reloadTheirs()`,
 * `keepMine()`), a save taking feeding ways in `feeds` (`confirmFeeds()`, `holdFeeds()`); a
 * server out of reach keeps the draft and is retried, waiting longer each time. `save()`
 * answers after its first attempt: whether the draft is saved now.
 */
export function useBoardSave(boardId: string, enabled: boolean) {
  const { mutate } = useMutation({
    mutationKey: ['board-save', boardId],
    scope: { id: `board-save:${boardId}` },
    mutationFn: (settle: (saved: boolean) => void) => saveAttempt(boardId, settle),
    retry: (_failures, err) => passing(err),
    retryDelay: (failures) => Math.min(RETRY_FIRST_MS * 2 ** failures, 60_000),
    networkMode: 'always',
  });

  const save = useCallback(
    (): Promise<boolean> => (enabled ? new Promise<boolean>((settle) => mutate(settle)) : Promise.resolve(false)),
    [enabled, mutate],
  );

  // Autosave: a few seconds after the last change
  useEffect(() => {
    if (!enabled) return;
    let timer: ReturnType<typeof setTimeout> | undefined;
    const unsubscribe = useBoardDraftStore.subscribe((state, previous) => {
      if (state.editSeq === previous.editSeq || !state.dirty) return;
      if (timer) clearTimeout(timer);
      timer = setTimeout(() => void save(), AUTOSAVE_MS);
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

  /** Saves the draft, the boards fed from the ways it removes going back to the origin. */
  const confirmFeeds = useCallback(async () => {
    useSaveStore.getState().set({ phase: 'idle', feedChanges: null, message: null, confirmFeeds: true });
    await save();
  }, [save]);

  /** Keeps editing without saving (the draft stays unsaved, here and in this browser tab). */
  const holdFeeds = useCallback(() => {
    const message = 'Not saved: a way that feeds another board was taken away.';
    useSaveStore.getState().set({ phase: 'idle', feedChanges: null, message });
  }, []);

  return { save, reloadTheirs, keepMine, confirmFeeds, holdFeeds };
}
