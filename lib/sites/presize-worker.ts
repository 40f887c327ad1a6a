/**
 * The presize worker: sizes a site in a worker thread of the presize pool (lib/sites/presize-pool.ts),
 * so that the engine's CPU and the garbage of its answers stay off the server's event loop.
 * Bundled into `<distDir>/presize-worker.mjs` by scripts/build-workers.mjs after `next build`.
 */
import { LRUCache } from 'lru-cache';

import { deepFreeze } from '@/lib/sizing/validate';
import type { TreeBoard } from '@/lib/supply/size-tree';

import { presizeTree, type PresizeAnswer } from './presize';
import type { SiteOrigin } from './tree-types';

/** A task as the pool sends it: each board as the JSON text the database gave it. */
export type PresizeJob = { siteId: string; origin: SiteOrigin | null; boards: { id: string; text: string }[] };

/**
 * Each board as last parsed, by id, with the text it came from: a board whose text is the same
 * is the very frozen object again, whose engine input is parsed already (lib/supply/size-tree.ts).
 */
const parsed = new LRUCache<string, { text: string; board: TreeBoard }>({ max: 2000 });

export default function presize(job: PresizeJob): PresizeAnswer {
  const boards = job.boards.map(({ id, text }) => {
    const held = parsed.get(id);
    if (held?.text === text) return held.board;
    const board = deepFreeze(JSON.parse(text) as TreeBoard);
    parsed.set(id, { text, board });
    return board;
  });
  return presizeTree({ siteId: job.siteId, origin: job.origin, boards });
}
