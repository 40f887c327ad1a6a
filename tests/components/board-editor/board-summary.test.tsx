import { screen } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';

import { BoardSummary } from '@/features/board-editor/components/board-summary';
import { useBoardDraftStore } from '@/features/board-editor/stores/board-draft-store';
import { boardSizingInput } from '@/lib/boards/sizing-input';
import { boardInputSchema, sizeBoard } from '@/lib/sizing';

import { demoBoard } from './fixtures';
import { renderEditorPart } from './harness';

const store = () => useBoardDraftStore.getState();

beforeEach(() => {
  store().reset();
});

function sized(which: 'flat' | 'workshop') {
  store().load(demoBoard(which));
  const result = sizeBoard(boardInputSchema.parse(boardSizingInput(store().settings!, store().ways)));
  return renderEditorPart(<BoardSummary />, result);
}

describe('the editor’s board summary counts ways as they are numbered', () => {
  it('the flat: ways 1–9 are nine ways (not the twelve devices on the rail)', () => {
    sized('flat');
    expect(screen.getByTestId('way-counts').textContent).toBe('· 9 ways: 8 circuits, 1 spare');
  });

  it('the workshop: way numbers stop at 8L3, so 8 ways of 24 single-pole positions', () => {
    sized('workshop');
    expect(screen.getByTestId('way-counts').textContent).toBe(
      '· 8 ways (24 single-pole positions): 15 circuits, 3 positions spare',
    );
  });
});
