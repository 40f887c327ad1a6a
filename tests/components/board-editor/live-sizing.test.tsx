import { useEffect } from 'react';
import { act, waitFor } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

import { DndContext } from '@dnd-kit/core';

import { DrawnBoard } from '@/features/board-editor/components/drawn-board';
import { LiveSizing, useDraftSizing, useSizingState } from '@/features/board-editor/hooks/use-live-sizing';
import { useBoardDraftStore } from '@/features/board-editor/stores/board-draft-store';
import { boardSizingInput } from '@/lib/boards/sizing-input';
import { boardInputSchema, sizeBoard, type BoardResult } from '@/lib/sizing';

import { renderWithQuery } from '../helpers';
import { demoBoard } from './fixtures';

const store = () => useBoardDraftStore.getState();

/** A made-up answer that names itself, so the test can tell which one is shown. */
const answer = (tag: number) => ({ ways: [], summary: { maxDemandA: tag } }) as unknown as BoardResult;

/** What a component inside the live sizing reads: the answer shown, its edit sequence, pending and error. */
const seenBox: { current: { tag?: number; sizedFor?: number; pending: boolean; error: string | null } } = {
  current: { pending: false, error: null },
};
function Probe() {
  const tag = useDraftSizing((s) => s.result.summary.maxDemandA);
  const sizedFor = useDraftSizing((s) => s.editSeq);
  const state = useSizingState();
  useEffect(() => {
    seenBox.current = { tag, sizedFor, ...state };
  });
  return null;
}

function open() {
  const board = demoBoard('flat');
  store().load(board);
  renderWithQuery(
    <LiveSizing boardId={board.id} enabled>
      <Probe />
    </LiveSizing>,
  );
  return board;
}

type Pending = {
  url: string;
  body: { draft: { ways: unknown[] } };
  signal: AbortSignal;
  resolve: (r: Response) => void;
};

let calls: Pending[];
beforeEach(() => {
  store().reset();
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

/** The engine's own sizing of the draft as it is now, as the route would answer. */
const sized = () => sizeBoard(boardInputSchema.parse(boardSizingInput(store().settings!, store().ways)));
const replyWith = (call: Pending, result: BoardResult) =>
  act(async () => call.resolve(new Response(JSON.stringify(result), { status: 200 })));

const reply = (call: Pending, tag: number) =>
  act(async () => call.resolve(new Response(JSON.stringify(answer(tag)), { status: 200 })));

describe('live sizing of the draft', () => {
  it('sends the draft at once, sizes a burst of edits once, aborts what a newer edit makes worthless', async () => {
    const board = open();
    // The first sizing goes without waiting
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0].url).toBe(`/api/boards/${board.id}/sizing`);
    expect(calls[0].body.draft.ways).toHaveLength(board.ways.length);
    await reply(calls[0], 1);
    await waitFor(() => expect(seenBox.current).toMatchObject({ tag: 1, sizedFor: store().editSeq, pending: false }));

    // A quick burst of edits: one request follows it, with the last edit; the shown answer stays meanwhile
    const way = store().ways.find((w) => w.circuit)!;
    await new Promise((r) => setTimeout(r, 200));
    // (one act: on a loaded machine a wait between the edits could outlast the debounce)
    act(() => {
      // The first edit after a quiet spell goes at once
      store().updateCircuit(way.id, { ...way.circuit!, lengthM: 20 }, 'len');
      expect(calls).toHaveLength(2);
      store().updateCircuit(way.id, { ...way.circuit!, lengthM: 21 }, 'len');
      store().updateCircuit(way.id, { ...way.circuit!, lengthM: 22 }, 'len');
    });
    expect(calls).toHaveLength(2);
    expect(seenBox.current).toMatchObject({ tag: 1, pending: true });
    await waitFor(() => expect(calls).toHaveLength(3), { timeout: 1000 });
    // The request for the first edit of the burst was aborted once the newer one went
    await waitFor(() => expect(calls[1].signal.aborted).toBe(true));
    const sent = calls[2].body.draft.ways as { id: string; circuit: { lengthM: number } }[];
    expect(sent.find((w) => w.id === way.id)!.circuit.lengthM).toBe(22);

    // A late answer for the aborted request is never shown
    await reply(calls[1], 99);
    expect(seenBox.current.tag).toBe(1);
    await reply(calls[2], 3);
    await waitFor(() => expect(seenBox.current).toMatchObject({ tag: 3, sizedFor: store().editSeq, pending: false }));
  });

  it('a failed sizing is reported and the draft stays editable', async () => {
    open();
    await waitFor(() => expect(calls).toHaveLength(1));
    await act(async () =>
      calls[0].resolve(
        new Response(
          JSON.stringify({ error: 'Some fields are not valid.', issues: [{ path: 'ways.2.circuit', message: 'bad' }] }),
          {
            status: 400,
          },
        ),
      ),
    );
    await waitFor(() => expect(seenBox.current.error).toBe('Some fields are not valid. (ways.2.circuit: bad)'));
    expect(seenBox.current.pending).toBe(false);
    act(() => store().removeWay(store().ways[2].id));
    expect(store().dirty).toBe(true);
  });

  it('a change to one circuit touches the drawn board once and that way only; the answer, only the ways it changed', async () => {
    const board = demoBoard('flat');
    store().load(board);
    const { container } = renderWithQuery(
      <LiveSizing boardId={board.id} enabled>
        <DndContext>
          <DrawnBoard readOnly={false} showVerdicts />
        </DndContext>
      </LiveSizing>,
    );
    await waitFor(() => expect(calls).toHaveLength(1));
    const first = sized();
    await replyWith(calls[0], first);
    const drawn = container.querySelector<HTMLElement>('[data-testid="drawn-board"]')!;
    await waitFor(() => expect(drawn.dataset.sizedFor).toBe(String(store().editSeq)));
    expect(drawn.dataset.sizing).toBe('done');

    // Which ways' DOM (device on the rail, legend entry) changes from here on
    const touched = new Set<string>();
    const note = (records: MutationRecord[]) => {
      for (const r of records) {
        const el = r.target instanceof Element ? r.target : r.target.parentElement;
        const way = el?.closest<HTMLElement>('[data-way-id],[data-legend-way]');
        if (way) touched.add(way.dataset.wayId ?? way.dataset.legendWay!);
      }
    };
    const observer = new MutationObserver(note);
    observer.observe(drawn, { subtree: true, childList: true, attributes: true, characterData: true });
    const flush = async () => {
      await new Promise<void>((r) => setTimeout(r, 0));
      note(observer.takeRecords());
    };

    // A longer cable on one way: a sizing is on its way, said once on the board, no device redrawn for it
    await new Promise((r) => setTimeout(r, 200));
    const way = store().ways.find((w) => w.circuit?.serves === 'Cooker: oven and hob')!;
    act(() => store().updateCircuit(way.id, { ...way.circuit!, lengthM: 19 }, 'len'));
    await waitFor(() => expect(calls).toHaveLength(2));
    expect(drawn.dataset.sizing).toBe('pending');
    expect(drawn.getAttribute('aria-busy')).toBe('true');
    await flush();
    expect([...touched]).toEqual([]);

    // Then a load that makes it fail; the answer is drawn in one go, touching only the ways
    // whose result changed since the answer shown
    act(() =>
      store().updateCircuit(way.id, { ...way.circuit!, load: { kind: 'known', watts: 10_000, powerFactor: 1 } }),
    );
    await waitFor(() => expect(calls).toHaveLength(3));
    await replyWith(calls[2], sized());
    await waitFor(() => expect(drawn.dataset.sizedFor).toBe(String(store().editSeq)));
    expect(drawn.dataset.sizing).toBe('done');
    await flush();
    const changed = sized()
      .ways.filter((w, i) => JSON.stringify(w) !== JSON.stringify(first.ways[i]))
      .map((w) => w.id);
    expect(changed).toContain(way.id);
    expect([...touched].sort()).toEqual([...new Set([way.id, ...changed])].sort());
    expect(container.querySelector(`[data-way-id="${way.id}"] [data-verdict]`)!.getAttribute('data-verdict')).toBe(
      'fails',
    );
    observer.disconnect();
  });
});
