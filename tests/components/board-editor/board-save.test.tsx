import { act } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

import { useBoardSave } from '@/features/board-editor/hooks/use-board-save';
import { draftKey, readStoredDraft, useDraftPersistence } from '@/features/board-editor/hooks/use-draft-persistence';
import { useBoardDraftStore } from '@/features/board-editor/stores/board-draft-store';
import { useSaveStore } from '@/features/board-editor/stores/save-store';
import type { EditorBoard } from '@/features/board-editor/types/draft';

import { json, mockFetch, renderWithQuery, sentBody } from '../helpers';
import { demoBoard } from './fixtures';

const store = () => useBoardDraftStore.getState();
type Api = ReturnType<typeof useBoardSave>;

function Harness({ boardId, onApi }: { boardId: string; onApi: (api: Api) => void }) {
  useDraftPersistence(boardId, true);
  onApi(useBoardSave(boardId, true));
  return null;
}

/** The board as the API returns it after a save at `version`. */
function dto(board: EditorBoard, version: number, ways = board.ways) {
  return {
    board: {
      ...board.settings,
      id: board.id,
      siteId: 's',
      siteName: 'Site',
      status: 'draft',
      version,
      revision: 1,
      updatedAt: '',
      ways,
    },
  };
}

let board: EditorBoard;
let api: Api;
beforeEach(() => {
  store().reset();
  useSaveStore.getState().reset();
  window.sessionStorage.clear();
  board = demoBoard('flat', 3);
  store().load(board);
  renderWithQuery(<Harness boardId={board.id} onApi={(a) => (api = a)} />);
});
afterEach(() => vi.unstubAllGlobals());

/** An edit the designer makes: the fourth way's length. */
function edit(lengthM: number) {
  const way = store().ways.find((w) => w.circuit)!;
  act(() => store().updateCircuit(way.id, { ...way.circuit!, lengthM }));
  return way.id;
}

describe('saving the draft', () => {
  it('saves at the version the draft builds on, then forgets the kept copy', async () => {
    const fetch = mockFetch(json(dto(board, 4)));
    edit(33);
    expect(readStoredDraft(board.id)?.baseVersion).toBe(3);
    await act(async () => expect(await api.save()).toBe(true));
    expect(fetch.mock.calls[0][0]).toBe(`/api/boards/${board.id}`);
    expect(fetch.mock.calls[0][1]?.method).toBe('PUT');
    expect(sentBody(fetch)).toMatchObject({ version: 3, settings: board.settings });
    expect(store().baseVersion).toBe(4);
    expect(store().dirty).toBe(false);
    expect(window.sessionStorage.getItem(draftKey(board.id))).toBeNull();
  });

  it('a stale version: the prompt state, the draft untouched; "keep mine" saves on top of theirs', async () => {
    const fetch = mockFetch(
      json({ error: 'Someone else saved this board after you opened it.', currentVersion: 7 }, 409),
      json(dto(board, 8)),
    );
    const id = edit(41);
    await act(async () => expect(await api.save()).toBe(false));
    expect(useSaveStore.getState()).toMatchObject({ phase: 'conflict', theirVersion: 7 });
    expect(store().ways.find((w) => w.id === id)!.circuit!.lengthM).toBe(41);
    expect(readStoredDraft(board.id)?.ways.find((w) => w.id === id)?.circuit?.lengthM).toBe(41);
    // While the prompt is up, autosave and Save do nothing
    await act(async () => expect(await api.save()).toBe(false));
    expect(fetch).toHaveBeenCalledTimes(1);

    await act(async () => api.keepMine());
    expect(sentBody(fetch, 1)).toMatchObject({ version: 7 });
    expect(store().baseVersion).toBe(8);
    expect(store().dirty).toBe(false);
    expect(useSaveStore.getState().phase).toBe('saved');
  });

  it('a save that takes a feeding way asks first; "save and feed from the origin" sends the confirmation', async () => {
    const feedChanges = [
      {
        boardId: 'b2',
        name: 'Finishing room DB2',
        from: { boardId: board.id, boardName: 'Flat CU', wayId: 'w9', wayLabel: '9', device: '', cable: '' },
        to: 'origin',
        reason: 'way-removed',
      },
    ];
    const fetch = mockFetch(
      json({ error: 'This save takes away the way that feeds Finishing room DB2.', feedChanges }, 409),
      json(dto(board, 4)),
    );
    const id = edit(18);
    await act(async () => expect(await api.save()).toBe(false));
    expect(useSaveStore.getState()).toMatchObject({ phase: 'feeds', feedChanges });
    expect(sentBody(fetch)).not.toHaveProperty('confirmFeedChanges');
    expect(store().ways.find((w) => w.id === id)!.circuit!.lengthM).toBe(18);
    // While the question is open, autosave and Save send nothing
    await act(async () => expect(await api.save()).toBe(false));
    expect(fetch).toHaveBeenCalledTimes(1);

    await act(async () => api.confirmFeeds());
    expect(sentBody(fetch, 1)).toMatchObject({ version: 3, confirmFeedChanges: true });
    expect(store().dirty).toBe(false);
    expect(useSaveStore.getState()).toMatchObject({ phase: 'saved', feedChanges: null, confirmFeeds: false });
  });

  it('"keep editing" leaves the draft unsaved, says so, and the next save asks again', async () => {
    const refusal = json(
      {
        error: 'takes away',
        feedChanges: [{ boardId: 'b2', name: 'DB2', from: null, to: 'origin', reason: 'way-removed' }],
      },
      409,
    );
    const fetch = mockFetch(
      refusal,
      json(
        {
          error: 'takes away',
          feedChanges: [{ boardId: 'b2', name: 'DB2', from: null, to: 'origin', reason: 'way-removed' }],
        },
        409,
      ),
    );
    edit(19);
    await act(async () => void (await api.save()));
    act(() => api.holdFeeds());
    expect(useSaveStore.getState()).toMatchObject({ phase: 'idle', feedChanges: null });
    expect(useSaveStore.getState().message).toMatch(/Not saved/);
    expect(store().dirty).toBe(true);
    await act(async () => expect(await api.save()).toBe(false));
    expect(fetch).toHaveBeenCalledTimes(2);
    expect(sentBody(fetch, 1)).not.toHaveProperty('confirmFeedChanges');
    expect(useSaveStore.getState().phase).toBe('feeds');
  });

  it('"reload theirs" drops this draft for the stored board', async () => {
    const theirs = board.ways.slice(0, 5);
    mockFetch(json({ error: 'stale', currentVersion: 9 }, 409), json(dto(board, 9, theirs)));
    edit(12);
    await act(async () => void (await api.save()));
    await act(async () => api.reloadTheirs());
    expect(store().ways.map((w) => w.id)).toEqual(theirs.map((w) => w.id));
    expect(store().baseVersion).toBe(9);
    expect(store().dirty).toBe(false);
    expect(useSaveStore.getState().phase).toBe('idle');
    expect(window.sessionStorage.getItem(draftKey(board.id))).toBeNull();
  });

  it('a failed save says so and keeps the draft in memory and in the tab', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('network down'))),
    );
    const id = edit(57);
    await act(async () => expect(await api.save()).toBe(false));
    expect(useSaveStore.getState().phase).toBe('failed');
    expect(useSaveStore.getState().message).toMatch(/kept in this browser/);
    expect(store().dirty).toBe(true);
    expect(readStoredDraft(board.id)?.ways.find((w) => w.id === id)?.circuit?.lengthM).toBe(57);
  });

  it('a failed save is tried again on its own, later each time, until it goes through', async () => {
    vi.useFakeTimers();
    try {
      const fetch = mockFetch(
        json({ error: 'The database is not reachable just now.' }, 503),
        json({ error: 'The database is not reachable just now.' }, 503),
        json(dto(board, 4)),
      );
      edit(61);
      // The autosave, 3 s after the edit, fails
      await act(async () => void (await vi.advanceTimersByTimeAsync(3_100)));
      expect(fetch).toHaveBeenCalledTimes(1);
      expect(useSaveStore.getState().phase).toBe('failed');
      // It failed at 3.0 s: the first retry comes 5 s later (8.0 s), the second 10 s after that
      await act(async () => void (await vi.advanceTimersByTimeAsync(4_800)));
      expect(fetch).toHaveBeenCalledTimes(1);
      await act(async () => void (await vi.advanceTimersByTimeAsync(200)));
      expect(fetch).toHaveBeenCalledTimes(2);
      await act(async () => void (await vi.advanceTimersByTimeAsync(9_800)));
      expect(fetch).toHaveBeenCalledTimes(2);
      await act(async () => void (await vi.advanceTimersByTimeAsync(300)));
      expect(fetch).toHaveBeenCalledTimes(3);
      expect(useSaveStore.getState().phase).toBe('saved');
      expect(store().dirty).toBe(false);
    } finally {
      vi.useRealTimers();
    }
  });

  it('a board in review is not saved and says why', async () => {
    mockFetch(json({ error: 'The board is in review; it can be changed once the inspector returns it.' }, 409));
    edit(20);
    await act(async () => void (await api.save()));
    expect(useSaveStore.getState()).toMatchObject({ phase: 'locked' });
    expect(useSaveStore.getState().message).toMatch(/in review/);
    expect(store().dirty).toBe(true);
  });
});
