import type { BoardSettings, WayInput } from '@/lib/boards/schemas';
import type { BoardStatus } from '@/lib/domain';

/** A way as the editor holds it: the same shape the save route takes. */
export type EditorWay = WayInput;

/** What the editor edits and saves: the board's settings and its ways. */
export type DraftSnapshot = { settings: BoardSettings; ways: EditorWay[] };

/** A board as the editor opens it. */
export type EditorBoard = DraftSnapshot & { id: string; version: number; status: BoardStatus };

/** The answer to an edit that may be refused: the reason is in words for the designer. */
export type EditResult = { ok: true } | { ok: false; reason: string };
