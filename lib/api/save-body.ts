import type { BoardDto } from '@/lib/boards/types';

/**
 * The body the board editor sends to save a board unchanged at its current version (for the
 * tests and benchmarks that save through `PUT /api/boards/:id`).
 */
export function saveBodyOf(board: BoardDto) {
  const { name, location, phases, supply, incoming, enclosureModules, rails, dwelling } = board;
  return {
    version: board.version,
    settings: { name, location, phases, supply, incoming, enclosureModules, rails, dwelling },
    ways: board.ways.map(({ id, rail, position, device, circuit }) => ({ id, rail, position, device, circuit })),
  };
}
