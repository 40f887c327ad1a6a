import { briefsOf, sizeTree, type SizedBrief, type TreeBoard } from '@/lib/supply/size-tree';

import { treeDtoOf, treePartsJson } from './tree-dto';
import type { SiteOrigin } from './tree-types';

/**
 * A site re-sized ahead of its write (lib/dal/site-tree.ts `presizeSite`): pure, so that it runs
 * in this process (`next dev`, tests) or in the presize worker (presize-worker.ts) alike.
 */

/** The site's boards and the origin to size them with. */
export type PresizeTask = { siteId: string; origin: SiteOrigin | null; boards: readonly TreeBoard[] };

/**
 * What the write needs of the sized site: each board's brief (what it stores and compares
 * unless a sizing is stored whole) and the tree's boards and edges as the answer gives them, as
 * JSON text (`treePartsJson`: the answer is sent as it is, never parsed in the server).
 */
export type PresizeAnswer = {
  briefs: Map<string, SizedBrief>;
  treeParts: string;
};

/** Sizes the site as one tree and answers its briefs and the tree's boards and edges. */
export function presizeTree({ siteId, origin, boards }: PresizeTask): PresizeAnswer {
  const sized = sizeTree(siteId, origin, boards);
  const tree = treeDtoOf({ id: siteId, name: '', origin, treeVersion: 0 }, boards, sized);
  return { briefs: briefsOf(sized), treeParts: treePartsJson(tree) };
}
