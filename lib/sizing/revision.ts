/**
 * The engine's revision, stored with every sizing (`board_sizings.engine`, migration 0014): a
 * stored sizing of another revision is not current, so its first read sizes the board (or its
 * site's tree) again and stores it (lib/dal/board-repository.ts `CURRENT_SIZING`). Without it an
 * older engine's answer would be served until its board was written again.
 *
 * `ENGINE_ANSWERS` is the SHA-256 of the engine's answers for a fixed set of boards and trees
 * (tests/unit/sizing/engine-revision.test.ts). A change that changes any of those answers fails
 * that test until both lines below are changed together: the revision raised by one, and the
 * answers' new hash recorded. Raise the revision too for a change to answers the set misses.
 */
export const ENGINE_REVISION = 1;
export const ENGINE_ANSWERS = 'a0d5388b0bdbd70c96913a4ed729be866f5491f49984a3e2746f177b658f000c';
