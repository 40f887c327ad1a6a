import 'server-only';

import { LRUCache } from 'lru-cache';

import { fieldIssues } from '@/lib/api/handler';
import type { Actor } from '@/lib/auth/session';
import type { BoardSnapshot } from '@/lib/boards/revision-diff';
import { boardSizingInput } from '@/lib/boards/sizing-input';
import type { BoardDto } from '@/lib/boards/types';
import { getBoardUnless, type BoardStamp } from '@/lib/dal/boards';
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
 * The last stored state sized of each board, in each server process, with that state's stamp.
 * The result is a pure function of the board's settings and ways, and every write of those
 * (`saveBoard`, the review steps) raises the board's version and `updated_at`, so the stamp
 * names one stored state. It takes `updated_at` too, so that a database restored to an older
 * version and edited again cannot meet an entry of the same version number. Bounded to about
 * 32 MB a process by an estimate of each entry's memory: about 3 kB a way, the result's
 * objects and its JSON bytes (measured: 108 kB for 37 ways), so some 300 such boards. On
 * globalThis: the route's bundle and the pages' share it.
 */
type Kept = { stamp: BoardStamp; sized: StoredSizing };
const memo: LRUCache<string, Kept> = ((globalThis as { __boardSizingMemo?: LRUCache<string, Kept> })
  .__boardSizingMemo ??= new LRUCache<string, Kept>({
  maxSize: 32 * 1024 * 1024,
  sizeCalculation: (kept) => 4096 + kept.sized.wayCount * 3072,
}));

/** The sizing of a board just read: the kept one when it is of this very state. */
export function sizeStoredBoard(board: BoardDto): StoredSizing {
  const kept = memo.get(board.id);
  if (kept && kept.stamp.version === board.version && kept.stamp.updatedAt === board.updatedAt) {
    return kept.sized;
  }
  const sized = new StoredSizing(sizeSnapshot({ settings: board, ways: board.ways }), board.ways.length);
  memo.set(board.id, { stamp: { version: board.version, updatedAt: board.updatedAt }, sized });
  return sized;
}

/**
 * The stored board's sizing, checked to be the caller's organisation's (404 otherwise), in
 * one statement: it answers the board's stamp only when the kept sizing is still current,
 * else the board, which is sized and kept.
 */
export async function storedBoardSizing(actor: Actor, boardId: string): Promise<StoredSizing> {
  const kept = memo.get(boardId);
  const { board } = await getBoardUnless(actor, boardId, kept?.stamp ?? null);
  return board ? sizeStoredBoard(board) : kept!.sized;
}
