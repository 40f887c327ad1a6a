import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// A stored sizing is the engine's answer when it was stored, and a board is not sized again
// until it is written or left pending. `engine` is the engine's revision that made it
// (lib/sizing/revision.ts ENGINE_REVISION): a sizing of another revision is not current
// (lib/dal/board-repository.ts CURRENT_SIZING), so its first read sizes the board (or its site's
// tree) again with the engine of the release and stores it. Rows stored before have none, so
// every one is sized again once. Issued revisions keep what was issued.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('alter table board_sizings add column engine smallint');
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('alter table board_sizings drop column engine');
};
