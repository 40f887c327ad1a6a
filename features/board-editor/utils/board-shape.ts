import { saveInputOf } from '@/lib/boards/schemas';
import type { BoardDto } from '@/lib/boards/types';

import type { EditorBoard } from '../types/draft';

/** A board as the editor opens it: its id, stage and save input (`saveInputOf`, the board's one shape). */
export function editorBoard(board: BoardDto): EditorBoard {
  return { id: board.id, status: board.status, ...saveInputOf(board) };
}
