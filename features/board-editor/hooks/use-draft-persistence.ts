'use client';

import { useEffect } from 'react';
import { z } from 'zod';

import { boardSettingsSchema, wayInputSchema } from '@/lib/boards/schemas';

import { useBoardDraftStore } from '../stores/board-draft-store';
import type { DraftSnapshot } from '../types/draft';

const storedDraftSchema = z.object({
  boardId: z.string(),
  baseVersion: z.number().int(),
  settings: boardSettingsSchema,
  ways: z.array(wayInputSchema),
});

/** An unsaved draft kept in this browser tab, and the version it was built on. */
type StoredDraft = DraftSnapshot & { baseVersion: number };

/** The session-storage key of a board's unsaved draft. */
export function draftKey(boardId: string): string {
  return `boardwright:draft:${boardId}`;
}

/** The unsaved draft kept for a board, or null (none, unreadable, or no longer valid). */
export function readStoredDraft(boardId: string): StoredDraft | null {
  try {
    const raw = window.sessionStorage.getItem(draftKey(boardId));
    if (!raw) return null;
    const parsed = storedDraftSchema.safeParse(JSON.parse(raw));
    if (!parsed.success || parsed.data.boardId !== boardId) return null;
    const { baseVersion, settings, ways } = parsed.data;
    return { baseVersion, settings, ways };
  } catch {
    return null;
  }
}

/** Forgets the kept draft of a board. */
export function clearStoredDraft(boardId: string): void {
  try {
    window.sessionStorage.removeItem(draftKey(boardId));
  } catch {
    // Storage refused (private mode): nothing was kept
  }
}

/**
 * Keeps the unsaved draft in session storage while it differs from what was saved, so that a
 * reload or a failed save loses nothing; forgets it once the draft is saved.
 */
export function useDraftPersistence(boardId: string, enabled: boolean): void {
  useEffect(() => {
    if (!enabled) return;
    const write = () => {
      const { boardId: openId, settings, ways, baseVersion, dirty } = useBoardDraftStore.getState();
      if (openId !== boardId || !settings) return;
      try {
        if (dirty) {
          window.sessionStorage.setItem(draftKey(boardId), JSON.stringify({ boardId, baseVersion, settings, ways }));
        } else {
          window.sessionStorage.removeItem(draftKey(boardId));
        }
      } catch {
        // Storage full or refused: the draft stays in memory
      }
    };
    return useBoardDraftStore.subscribe((state, previous) => {
      if ((['ways', 'settings', 'dirty', 'baseVersion'] as const).some((k) => state[k] !== previous[k])) write();
    });
  }, [boardId, enabled]);
}
