/**
 * What the site view and a board's supply panel need from a site's tree (`SiteTreeDto`, as the
 * server answers it): which boards change when one is re-pointed, and which ways of the other
 * boards can feed a board, and whether a board is near the limit through its selectivity alone.
 * Pure: no fetching, no React.
 */
import { fedFromWords, wayName } from '@/lib/names';
import type { SiteTreeBoard } from '@/lib/sites/tree-types';

/** Where a board is fed from, as the feed route takes it. */
export type FeedChoice = { from: 'origin' } | { from: 'way'; boardId: string; wayId: string };

/** A way of a board, as much of it as the feed choice shows. */
export type FeedWay = SiteTreeBoard['ways'][number];

/** A board of the site, as much of it as linking needs. */
export type TreeBoard = Pick<SiteTreeBoard, 'boardId' | 'name' | 'phases' | 'feed' | 'ways'>;

/** The key of a feed choice, as a select's value: "origin" or "<boardId>:<wayId>". */
export function feedKey(feed: FeedChoice): string {
  return feed.from === 'origin' ? 'origin' : `${feed.boardId}:${feed.wayId}`;
}

/** The feed choice a select's value stands for. */
export function feedOfKey(key: string): FeedChoice {
  if (key === 'origin') return { from: 'origin' };
  const [boardId, wayId] = key.split(':');
  return { from: 'way', boardId, wayId };
}

/** Every board below `boardId` (its children, theirs, ...), in tree order, without itself. */
export function boardsBelow(boards: readonly TreeBoard[], boardId: string): TreeBoard[] {
  const out: TreeBoard[] = [];
  const seen = new Set<string>([boardId]);
  const walk = (id: string) => {
    for (const b of boards) {
      if (b.feed.from === 'way' && b.feed.boardId === id && !seen.has(b.boardId)) {
        seen.add(b.boardId);
        out.push(b);
        walk(b.boardId);
      }
    }
  };
  walk(boardId);
  return out;
}

/** A way in words: "way 9L1–L3" (or "a way with no number"). */
export function feedWayWords(way: Pick<FeedWay, 'label'>): string {
  return way.label ? wayName(way.label) : 'a way with no number';
}

/** A feed choice in words: "the origin (the supply intake)" or "Workshop DB1, way 9L1–L3". */
export function feedWords(boards: readonly TreeBoard[], feed: FeedChoice): string {
  if (feed.from === 'origin') return fedFromWords(null);
  const parent = boards.find((b) => b.boardId === feed.boardId);
  if (!parent) return 'a board that is no longer on the site';
  const way = parent.ways.find((w) => w.id === feed.wayId);
  return fedFromWords({ boardName: parent.name, wayLabel: way?.label ?? null });
}

/** One group of the feed choice: a board and those of its ways that can feed another board. */
export interface FeedOptionGroup {
  boardId: string;
  boardName: string;
  ways: FeedWay[];
}

/**
 * The ways that may feed `boardId`: on every other board of the site, the ways whose use is
 * distribution (a sub-main), and the way that feeds it now. Boards below it are offered too:
 * choosing one is refused by the server (a loop) with its message, which the screen shows.
 */
export function feedOptions(boards: readonly TreeBoard[], boardId: string): FeedOptionGroup[] {
  const self = boards.find((b) => b.boardId === boardId);
  const current = self?.feed.from === 'way' ? self.feed : null;
  return boards
    .filter((b) => b.boardId !== boardId)
    .map((b) => ({
      boardId: b.boardId,
      boardName: b.name,
      ways: b.ways.filter(
        (w) => w.distribution || (current !== null && current.boardId === b.boardId && current.wayId === w.id),
      ),
    }))
    .filter((g) => g.ways.length > 0);
}

/** The name of the board a way feeds now, if any. */
export function boardFedBy(boards: readonly TreeBoard[], way: FeedWay): string | null {
  if (!way.feedsBoardId) return null;
  return boards.find((b) => b.boardId === way.feedsBoardId)?.name ?? null;
}

/** Whether two feed choices are the same. */
export function sameFeed(a: FeedChoice, b: FeedChoice): boolean {
  return feedKey(a) === feedKey(b);
}

/**
 * Whether a board is near the limit only through the selectivity below its sub-main (advisory):
 * no way is near the limit or failing, so the worst verdict was raised by a judgement below the
 * sub-main (lib/supply `worstVerdictOf`: a failing board check would make it fail).
 */
export function nearLimitBySelectivityOnly(b: Pick<SiteTreeBoard, 'worstVerdict' | 'sizing' | 'selectivity'>): boolean {
  if (b.worstVerdict !== 'near-limit' || !b.sizing || !b.selectivity.length) return false;
  const { counts } = b.sizing.summary;
  return counts.nearLimit === 0 && counts.fails === 0;
}
