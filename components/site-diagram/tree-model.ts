/**
 * What the site view and a board's supply panel need from a site's tree, worked out once in
 * the browser from the tree the server answers: which boards change when one is re-pointed,
 * and which ways of the other boards can feed a board. Pure: no fetching, no React.
 */
import { deviceName, fedFromWords, wayName } from '@/lib/names';

/** Where a board is fed from, as the feed route takes it. */
export type FeedChoice = { from: 'origin' } | { from: 'way'; boardId: string; wayId: string };

/** A way of a board, as much of it as the feed choice shows. */
export interface FeedWay {
  id: string;
  /** The printed way reference ("9L1–L3"), null for a device without one. */
  label: string | null;
  device: { kind: string; curve?: string; ratingA?: number | null; rcdMa?: number | null; poles: number };
  /** What the way serves, and whether its use is distribution (a sub-main). */
  serves: string | null;
  distribution: boolean;
}

/** A board of the site as the linking needs it. */
export interface TreeBoard {
  id: string;
  name: string;
  phases: 1 | 3;
  feed: FeedChoice;
  ways: FeedWay[];
}

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
      if (b.feed.from === 'way' && b.feed.boardId === id && !seen.has(b.id)) {
        seen.add(b.id);
        out.push(b);
        walk(b.id);
      }
    }
  };
  walk(boardId);
  return out;
}

/** A way in words for a choice: "way 9L1–L3, MCB C40 (Sub-main: finishing room board)". */
export function feedWayWords(way: FeedWay): string {
  const name = way.label ? wayName(way.label) : 'a way with no number';
  const device = deviceName(way.device);
  return way.serves ? `${name}, ${device} (${way.serves})` : `${name}, ${device}`;
}

/** A feed choice in words: "the origin (the supply intake)" or "Workshop DB1, way 9L1–L3". */
export function feedWords(boards: readonly TreeBoard[], feed: FeedChoice): string {
  if (feed.from === 'origin') return fedFromWords(null);
  const parent = boards.find((b) => b.id === feed.boardId);
  const way = parent?.ways.find((w) => w.id === feed.wayId);
  if (!parent) return 'a board that is no longer on the site';
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
 * distribution (a sub-main), plus the way that feeds it now. Boards below it are offered too:
 * choosing one is refused by the server with its message, which the screen shows.
 */
export function feedOptions(boards: readonly TreeBoard[], boardId: string): FeedOptionGroup[] {
  const self = boards.find((b) => b.id === boardId);
  const current = self?.feed.from === 'way' ? self.feed : null;
  return boards
    .filter((b) => b.id !== boardId)
    .map((b) => ({
      boardId: b.id,
      boardName: b.name,
      ways: b.ways.filter((w) => w.distribution || (current?.boardId === b.id && current.wayId === w.id)),
    }))
    .filter((g) => g.ways.length > 0);
}

/** The board a distribution way feeds now, if any. */
export function boardFedBy(boards: readonly TreeBoard[], boardId: string, wayId: string): TreeBoard | null {
  return boards.find((b) => b.feed.from === 'way' && b.feed.boardId === boardId && b.feed.wayId === wayId) ?? null;
}

/** Whether two feed choices are the same. */
export function sameFeed(a: FeedChoice, b: FeedChoice): boolean {
  return feedKey(a) === feedKey(b);
}
