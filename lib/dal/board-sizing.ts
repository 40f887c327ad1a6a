import 'server-only';

import type { BoardSnapshot } from '@/lib/boards/revision-diff';
import type { BoardDto } from '@/lib/boards/schemas';
import { sizeDesign, type SizedBoard } from '@/lib/dal/board-repository';

export { readStoredSizing, type SizedBoard, type StoredSizing } from '@/lib/dal/board-repository';

/** Sizes a snapshot of a board (an issued revision); a board the engine refuses gets its issues. */
export function sizeSnapshot(snapshot: Pick<BoardSnapshot, 'settings' | 'ways'>): SizedBoard {
  return sizeDesign({ ...snapshot.settings, ways: snapshot.ways });
}

/** Sizes a board as read. */
export function sizeStoredBoard(board: BoardDto): SizedBoard {
  return sizeDesign(board);
}
