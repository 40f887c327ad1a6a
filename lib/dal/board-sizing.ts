import 'server-only';

import type { BoardSnapshot } from '@/lib/boards/revision-diff';
import { sizeDesign, type SizedBoard } from '@/lib/dal/board-repository';

/**
 * Sizes a snapshot of a board (to freeze it in an issued revision); a board the engine refuses
 * gets its issues. A stored board's sizing is stored with it: `readSizedBoard` in
 * lib/dal/board-repository.ts.
 */
export function sizeSnapshot(snapshot: Pick<BoardSnapshot, 'settings' | 'ways'>): SizedBoard {
  return sizeDesign({ ...snapshot.settings, ways: snapshot.ways });
}
