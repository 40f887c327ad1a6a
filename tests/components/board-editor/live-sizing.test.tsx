import { act, render, waitFor } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

import { useLiveSizing } from '@/features/board-editor/hooks/use-live-sizing';
import { useBoardDraftStore } from '@/features/board-editor/stores/board-draft-store';
import { useSizingStore } from '@/features/board-editor/stores/sizing-store';
import type { BoardResult } from '@/lib/sizing';

import { demoBoard } from './fixtures';

const store = () => useBoardDraftStore.getState();

/** A made-up answer that names itself, so the test can tell which one is shown. */
const answer = (tag: number) =>
  ({ ways: [], summary: { maxDemandA: tag } }) as unknown as BoardResult;

function Harness({ boardId }: { boardId: string }) {
  useLiveSizing(boardId, true);
  return null;
}

type Pending = { url: string; body: { draft: { ways: unknown[] } }; signal: AbortSignal; resolve: (r: Response) => void };

let calls: Pending[];
beforeEach(() => {
  store().reset();
  useSizingStore.getState().reset();
  calls = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(
      (url: string, init: RequestInit) =>
        new Promise<Response>((resolve, reject) => {
          init.signal?.addEventListener('abort', () => reject(new DOMException('aborted', 'AbortError')));
          calls.push({ url, body: JSON.parse(String(init.body)), signal: init.signal!, resolve });
        }),
    ),
  );
});
afterEach(() => vi.unstubAllGlobals());

const reply = (call: Pending, tag: number) =>
  act(async () => call.resolve(new Response(JSON.stringify(answer(tag)), { status: 200 })));

describe('live sizing of the draft', () => {
  it('sends the draft at once, aborts it when a newer change comes, and shows only the newer answer', async () => {
    const board = demoBoard('flat');
    store().load(board);
    render(<Harness boardId={board.id} />);
    // The first sizing goes without waiting
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0].url).toBe(`/api/boards/${board.id}/sizing`);
    expect(calls[0].body.draft.ways).toHaveLength(board.ways.length);

    // Two quick edits: the request in flight is aborted; one request follows the burst
    const way = store().ways.find((w) => w.circuit)!;
    act(() => store().updateCircuit(way.id, { ...way.circuit!, lengthM: 20 }, 'len'));
    expect(calls[0].signal.aborted).toBe(true);
    act(() => store().updateCircuit(way.id, { ...way.circuit!, lengthM: 21 }, 'len'));
    expect(calls).toHaveLength(1);
    await waitFor(() => expect(calls).toHaveLength(2), { timeout: 1000 });
    const sent = calls[1].body.draft.ways as { id: string; circuit: { lengthM: number } }[];
    expect(sent.find((w) => w.id === way.id)!.circuit.lengthM).toBe(21);

    await reply(calls[1], 2);
    expect(useSizingStore.getState().forRevision).toBe(store().revision);
    expect(useSizingStore.getState().result?.summary.maxDemandA).toBe(2);
  });

  it('an answer for an older revision never replaces a newer one', () => {
    useSizingStore.getState().apply(5, answer(5));
    useSizingStore.getState().apply(4, answer(4));
    expect(useSizingStore.getState().result?.summary.maxDemandA).toBe(5);
    useSizingStore.getState().fail(3, 'late failure');
    expect(useSizingStore.getState().error).toBeNull();
  });

  it('a failed sizing is reported and the draft stays editable', async () => {
    const board = demoBoard('flat');
    store().load(board);
    render(<Harness boardId={board.id} />);
    await waitFor(() => expect(calls).toHaveLength(1));
    await act(async () =>
      calls[0].resolve(
        new Response(JSON.stringify({ error: 'Some fields are not valid.', issues: [{ path: 'ways.2.circuit', message: 'bad' }] }), {
          status: 400,
        }),
      ),
    );
    expect(useSizingStore.getState().error).toBe('Some fields are not valid. (ways.2.circuit: bad)');
    act(() => store().removeWay(store().ways[2].id));
    expect(store().dirty).toBe(true);
  });
});
