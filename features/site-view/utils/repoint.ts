import { boardsBelow, feedWords, type FeedChoice, type TreeBoard } from '@/components/site-diagram/tree-model';
import { plural } from '@/lib/names';

/** A change of feed the designer asked for, waiting for their yes. */
export interface PendingFeed {
  boardId: string;
  feed: FeedChoice;
}

/** What the confirmation says: the board, where it is fed from now and after, and who changes. */
export interface RepointWords {
  title: string;
  now: string;
  after: string;
  /** The boards whose supply values change: the board itself and every board below it. */
  changes: string[];
  summary: string;
}

/** The words of the question asked before a board's feed changes. */
export function repointWords(boards: readonly TreeBoard[], pending: PendingFeed): RepointWords {
  const board = boards.find((b) => b.boardId === pending.boardId);
  const name = board?.name ?? 'This board';
  const below = boardsBelow(boards, pending.boardId).map((b) => b.name);
  const changes = [name, ...below];
  return {
    title: `Feed ${name} from elsewhere?`,
    now: board ? feedWords(boards, board.feed) : 'unknown',
    after: feedWords(boards, pending.feed),
    changes,
    summary:
      below.length === 0
        ? `The supply values of ${name} change, and it is sized again with them.`
        : `The supply values of ${plural(changes.length, 'board')} change, and each is sized again: ${changes.join(', ')}.`,
  };
}
