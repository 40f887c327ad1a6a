import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// A stored sizing is the engine's answer at the time it was stored, and a board is not sized
// again until it is written or left pending. When the engine changes an answer (here: a board
// whose drawn main switch disagrees with the incoming main switch of its settings now fails,
// lib/sizing/board.ts), every stored sizing is marked pending, so that its first read sizes the
// board (or its site's tree) again with the engine of this release and stores it. Issued revisions
// keep what was issued. Down: nothing to undo (a pending sizing is only stored again on read).
export const MARK_STORED_SIZINGS_PENDING = `
  update board_sizings set pending = true, sizing = null, sizing_sha256 = null where not pending;
`;

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(MARK_STORED_SIZINGS_PENDING);
};

export const down: MigrationFn<QueryInterface> = async () => {};
