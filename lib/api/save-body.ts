import { saveInputOf } from '@/lib/boards/schemas';
import type { BoardDto } from '@/lib/boards/types';

/**
 * The body the board editor sends to save a board unchanged at its current version (for the
 * tests and benchmarks that save through `PUT /api/boards/:id`).
 */
export function saveBodyOf(board: BoardDto) {
  return saveInputOf(board);
}
