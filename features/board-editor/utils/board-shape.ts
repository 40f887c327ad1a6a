import type { BoardDto } from '@/lib/boards/types';

import type { DraftSnapshot, EditorBoard } from '../types/draft';

/**
 * The save route's input (without the version) from a board as the API sends it: its settings
 * and its ways, nothing else. The editor's draft has this shape; this is the one place in the
 * editor that spells it out.
 */
export function saveInputOf(board: BoardDto): DraftSnapshot {
  const { name, location, phases, supply, incoming, enclosureModules, rails, dwelling } = board;
  return {
    settings: { name, location, phases, supply, incoming, enclosureModules, rails, dwelling },
    ways: board.ways.map(({ id, rail, position, device, circuit }) => ({ id, rail, position, device, circuit })),
  };
}

/** A board as the editor opens it. */
export function editorBoard(board: BoardDto): EditorBoard {
  return { id: board.id, version: board.version, status: board.status, ...saveInputOf(board) };
}
