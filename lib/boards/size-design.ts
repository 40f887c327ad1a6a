import type { FieldIssue } from '@/lib/errors';
import { parseBoardInput, sizeBoard, SizingInputError, type BoardResult } from '@/lib/sizing';

import { engineInputOf, type BoardSettings, type WayInput } from './schemas';

/** A board sized, or the reasons the engine refused it (then `sizing` is null). */
export type SizedBoard = { sizing: BoardResult | null; issues: FieldIssue[] };

/** Sizes a board's settings and ways; a board the engine refuses gets its issues instead. */
export function sizeDesign(board: BoardSettings & { ways: readonly WayInput[] }): SizedBoard {
  // Parsed once, and marked so that the engine does not parse it again
  try {
    return { sizing: sizeBoard(parseBoardInput(engineInputOf(board, board.ways))), issues: [] };
  } catch (err) {
    return { sizing: null, issues: engineIssues(err) };
  }
}

/** The engine's refusal of a board's input as field issues; any other error is thrown on. */
export function engineIssues(err: unknown): FieldIssue[] {
  if (!(err instanceof SizingInputError)) throw err;
  return err.issues.map(({ path, message }) => ({ path: path || '(body)', message }));
}
