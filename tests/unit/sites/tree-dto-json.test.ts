import { describe, expect, it } from 'vitest';

import { treeDtoJson, treePartsJson, withTreeHead } from '@/lib/sites/tree-dto';
import type { SiteTreeDto } from '@/lib/sites/tree-types';

// The origin's route answers the tree as text spliced from the presize's boards and edges
// (lib/dal/site-supply.ts): it must be the very text JSON.stringify gives the DTO itself.

const origin = { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.5, source: 'public' } as const;

/** Boards and edges with text that JSON must escape (quotes, a backslash, a line break, non-ASCII). */
const parts = {
  boards: [
    { boardId: 'b1', name: 'Finishing room "DB2" \\ east', depth: 1, problem: 'line one\nline two', ways: [] },
    { boardId: 'b2', name: 'Flat 1 – CU ⚡', depth: 0, problem: null, ways: [{ id: 'w', label: '1' }] },
  ],
  edges: [{ fromBoardId: 'b2', toBoardId: 'b1', wayLabel: '3L2', designCurrent: { amps: 31.7 } }],
} as unknown as Pick<SiteTreeDto, 'boards' | 'edges'>;

describe('the tree DTO as text', () => {
  it('is the DTO’s own JSON, with an origin or none, and with no boards', () => {
    for (const site of [
      { id: 's1', name: 'Hollin Lane "Joinery"', origin, treeVersion: 12 },
      { id: 's2', name: 'Empty yard', origin: null, treeVersion: 0 },
    ]) {
      for (const p of [parts, { boards: [], edges: [] }]) {
        const text = treeDtoJson(site, treePartsJson(p));
        expect(text).toBe(JSON.stringify(withTreeHead(site, p)));
        expect(JSON.parse(text)).toEqual(withTreeHead(site, p));
      }
    }
  });
});
