import type { BoardFeed, WayInput } from '@/lib/boards/schemas';
import { isProtectiveDevice } from '@/lib/sizing';

/**
 * The rules of a board's feed from another board's way, pure: whether a way is fit to feed a
 * board, and whether a feed would close a loop. lib/dal/site-feed.ts checks a new feed with them.
 */

/** Why a way cannot feed a board of these phases, or null when it can. */
export function unfitReason(way: WayInput, wayWords: string, boardName: string, phases: 1 | 3): string | null {
  if (!isProtectiveDevice(way.device.kind) || !way.circuit) {
    return `${wayWords} cannot feed ${boardName}: a sub-main needs a protective device and a circuit`;
  }
  if (way.circuit.use !== 'distribution') {
    return `${wayWords} cannot feed ${boardName}: set its use to distribution (a sub-main) first`;
  }
  if (phases === 3 && way.circuit.phases !== 3) {
    return `${boardName} is three-phase, so it needs a three-phase sub-main, and ${wayWords} is single-phase`;
  }
  if (phases === 1 && way.circuit.phases === 3) {
    return `${boardName} is single-phase: feed it from a single-phase way (one phase), not the three-phase ${wayWords}`;
  }
  return null;
}

/**
 * The loop that feeding `boardId` from a way of `parentId` would close, in the direction the
 * power would flow (this board feeds … feeds the parent, which would feed it), or null.
 */
export function feedLoop<B extends { id: string; name: string; feed: BoardFeed }>(
  byId: ReadonlyMap<string, B>,
  boardId: string,
  parentId: string,
): { boardId: string; name: string }[] | null {
  // Follow the feeds up from the parent; meeting this board closes a loop
  const chain: B[] = [];
  let at = byId.get(parentId);
  while (at && !chain.includes(at)) {
    chain.push(at);
    if (at.id === boardId) return chain.reverse().map((b) => ({ boardId: b.id, name: b.name }));
    at = at.feed.from === 'way' ? byId.get(at.feed.boardId) : undefined;
  }
  return null;
}
