import { DndContext } from '@dnd-kit/core';
import { screen } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';

import { DrawnBoard } from '@/features/board-editor/components/drawn-board';
import { useBoardDraftStore } from '@/features/board-editor/stores/board-draft-store';
import type { DerivedSupply } from '@/lib/sites/tree-types';
import { sizeSite } from '@/lib/supply';

import { twoLevel } from '../../unit/supply/fixtures';
import { demoBoard } from './fixtures';
import { renderEditorPart } from './harness';

// The drawn board's header states the supply the board is sized with. A board fed from another
// board is sized with what the tree carries down (the board DTO's `derivedSupply`), not with its
// typed Ze and PFC: the header must show the carried Zdb and PFC, marked as carried.

const store = () => useBoardDraftStore.getState();

beforeEach(() => {
  store().reset();
});

/** What the tree carries to the finishing room's board (tests/unit/supply: hand-worked there). */
function carriedToFinishingRoom(): DerivedSupply {
  const fin = sizeSite(twoLevel()).boards.find((b) => b.boardId === 'fin')!;
  return {
    from: 'way',
    supply: fin.supply!,
    fedFrom: fin.fedFrom,
    phase: fin.phase,
    zdb: fin.zdb,
    pfc: fin.pfc,
    vdUsed: fin.vdUsed,
    subMainCurrent: fin.subMainCurrent,
    problem: null,
    treeVersion: 3,
  };
}

function renderHeader(derivedSupply?: DerivedSupply | null) {
  store().load(demoBoard('flat'));
  renderEditorPart(
    <DndContext>
      <DrawnBoard readOnly={false} showVerdicts derivedSupply={derivedSupply} />
    </DndContext>,
  );
  return screen.getByTestId('drawn-board-supply');
}

describe('the drawn board’s supply header', () => {
  it('a board outside a tree shows its typed supply', () => {
    // The flat's typed supply: TN-C-S, Ze 0.32 Ω, PFC 2.1 kA (scripts/demo-data.ts)
    expect(renderHeader(null).textContent).toBe('Single-phase · TN-C-S · Ze 0.32 Ω · PFC 2.1 kA');
  });

  it('a board fed from another board shows the carried Zdb and PFC, marked as carried, not its typed values', () => {
    const carried = carriedToFinishingRoom();
    // Zdb = Ze + (r1 + r2)·L·m = 0.35 + 0.093696 = 0.443696 Ω (tests/unit/supply/carried-values.test.ts)
    expect(carried.supply.zeOhm).toBeCloseTo(0.443696, 6);
    const header = renderHeader(carried);
    expect(header.textContent).toContain('Zdb 0.444 Ω (carried)');
    expect(header.textContent).toContain(`PFC ${carried.supply.pfcKa.toFixed(2)} kA (carried)`);
    expect(header.textContent).not.toContain('0.32');
    expect(header.textContent).not.toContain('2.1 kA');
    expect(header.getAttribute('title')).toBe(
      'Carried down from Workshop DB1, way 1; the board’s typed Ze and PFC are not used.',
    );
  });

  it('a board fed from the site’s origin shows the origin’s values, marked so', () => {
    const origin = twoLevel().origin;
    const header = renderHeader({
      from: 'origin',
      supply: origin,
      fedFrom: null,
      phase: null,
      zdb: null,
      pfc: null,
      vdUsed: null,
      subMainCurrent: null,
      problem: null,
      treeVersion: 1,
    });
    expect(header.textContent).toBe('Single-phase · TN-C-S · Ze 0.350 Ω (site origin) · PFC 1.50 kA (site origin)');
  });

  it('a feed the tree could not follow says so instead of claiming carried values', () => {
    const header = renderHeader({
      ...carriedToFinishingRoom(),
      supply: twoLevel().origin,
      fedFrom: null,
      zdb: null,
      pfc: null,
      problem: 'The board that fed Finishing room board is no longer on the site.',
    });
    expect(header.textContent).not.toContain('(carried)');
    expect(header.textContent).toContain('(not carried: see Supply)');
    expect(header.getAttribute('title')).toBe('The board that fed Finishing room board is no longer on the site.');
  });
});
