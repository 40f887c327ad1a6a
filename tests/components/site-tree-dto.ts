import type { SiteTreeDto } from '@/lib/sites/tree-types';
import { SIZING_CAUTION } from '@/lib/sizing';
import { groupSelectivity, sizeSite } from '@/lib/supply';
import { wayLabels } from '@/lib/supply/validate-tree';

import { threeLevel } from '../unit/supply/fixtures';

/** The three-level tree of the supply tests, sized, as the tree route answers it. */
export function treeDto(): SiteTreeDto {
  const input = threeLevel();
  const sized = sizeSite(input);
  return {
    siteId: 'site-1',
    siteName: 'Hollin Lane Joinery',
    origin: sized.origin,
    treeVersion: 3,
    caution: SIZING_CAUTION,
    edges: [],
    boards: sized.boards.map((b) => {
      const own = input.boards.find((x) => x.id === b.boardId)!;
      const labels = wayLabels(own.board);
      const { sizedInput: _dropped, ...rest } = b;
      void _dropped;
      return {
        ...rest,
        sizing: b.sizing ? { summary: b.sizing.summary } : null,
        selectivity: groupSelectivity(b.selectivity),
        location: '',
        phases: own.board.phases,
        status: 'draft',
        version: 1,
        feed:
          own.feed.from === 'origin'
            ? { from: 'origin' }
            : { ...own.feed, designCurrentOverride: null, upstreamRcdTimeDelayed: false },
        feedsBoards: [],
        ways: own.board.ways.map((w) => ({
          id: w.id,
          label: labels.get(w.id) ?? null,
          feedsBoardId: input.boards.find((x) => x.feed.from === 'way' && x.feed.wayId === w.id)?.id ?? null,
          distribution: w.circuit?.use === 'distribution',
        })),
      };
    }),
  } as SiteTreeDto;
}
