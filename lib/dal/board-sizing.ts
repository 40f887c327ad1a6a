import 'server-only';

import { LRUCache } from 'lru-cache';

import { fieldIssues } from '@/lib/api/handler';
import type { Actor } from '@/lib/auth/session';
import type { BoardSnapshot } from '@/lib/boards/revision-diff';
import { boardSizingInput } from '@/lib/boards/sizing-input';
import type { BoardDto } from '@/lib/boards/types';
import { getBoard, requireBoard, type BoardStamp } from '@/lib/dal/boards';
import type { FieldIssue } from '@/lib/errors';
import { boardInputSchema, sizeBoard, type BoardResult } from '@/lib/sizing';

/** A board sized, or the reasons the engine refused it (then `sizing` is null). */
export type SizedBoard = { sizing: BoardResult | null; issues: FieldIssue[] };

/** Sizes a snapshot of a board; a board the engine refuses gets its issues instead. */
export function sizeSnapshot(snapshot: Pick<BoardSnapshot, 'settings' | 'ways'>): SizedBoard {
  const checked = boardInputSchema.safeParse(boardSizingInput(snapshot.settings, snapshot.ways));
  if (!checked.success) return { sizing: null, issues: fieldIssues(checked.error) };
  return { sizing: sizeBoard(checked.data), issues: [] };
}

/**
 * A stored board's sizing, shared by every request that asks for the same stored state.
 * Frozen: callers read it and never change it. `body` is the sizing route's answer as UTF-8
 * JSON, made on first use (kept as bytes: turning a 50 kB string into bytes on every answer
 * was about 4 % of a server worker's time).
 */
export class StoredSizing implements SizedBoard {
  readonly sizing: BoardResult | null;
  readonly issues: FieldIssue[];
  #body: Uint8Array<ArrayBuffer> | undefined;

  constructor(sized: SizedBoard, readonly wayCount: number) {
    this.sizing = deepFreeze(sized.sizing);
    this.issues = deepFreeze(sized.issues);
  }

  get body(): Uint8Array<ArrayBuffer> {
    return (this.#body ??= new TextEncoder().encode(JSON.stringify(this.sizing)));
  }
}

function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const child of Object.values(value)) deepFreeze(child);
  }
  return value;
}

/**
 * Stored sizings by board state, in each server process. The result is a pure function of
 * the board's settings and ways, and every write of those (`saveBoard`, the review steps)
 * raises the board's version and `updated_at`, so the key names one stored state. The key
 * takes `updated_at` too, so that a database restored to an older version and edited again
 * cannot meet an entry of the same version number. Bounded by an estimate of the answer's
 * size (about 1.3 kB a way).
 */
const memo: LRUCache<string, StoredSizing> = ((globalThis as { __boardSizingMemo?: LRUCache<string, StoredSizing> })
  .__boardSizingMemo ??= new LRUCache<string, StoredSizing>({
  maxSize: 32 * 1024 * 1024,
  sizeCalculation: (entry) => 2048 + entry.wayCount * 1536,
}));

const memoKey = (boardId: string, stamp: BoardStamp) => `${boardId}@${stamp.version}@${stamp.updatedAt}`;

/** The sizing of a board just read, from the memo when that state was sized before. */
export function sizeStoredBoard(board: BoardDto): StoredSizing {
  const key = memoKey(board.id, board);
  let entry = memo.get(key);
  if (!entry) {
    entry = new StoredSizing(sizeSnapshot({ settings: board, ways: board.ways }), board.ways.length);
    memo.set(key, entry);
  }
  return entry;
}

/**
 * The stored board's sizing, checked to be the caller's organisation's (404 otherwise).
 * One small statement reads the board's version; the board itself is read and sized only
 * when that state is not in the memo.
 */
export async function storedBoardSizing(actor: Actor, boardId: string): Promise<StoredSizing> {
  const stamp = await requireBoard(actor, boardId);
  return memo.get(memoKey(boardId, stamp)) ?? sizeStoredBoard(await getBoard(actor, boardId));
}
