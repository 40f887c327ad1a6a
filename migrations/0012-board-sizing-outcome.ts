import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// `board_sizings.outcome`: the stored sizing in brief, written with it ({verdicts: way id →
// verdict, worst}, lib/supply sizingOutcome). Re-sizing a site compares every board's new way
// verdicts with the stored ones; reading them from the whole sizing (tens of kB of JSON per
// board, parsed again on every re-size) was most of the time a re-size held the site's lock.
// Null: written before this migration, or the engine refused the board (sizing null); the
// reader then takes the verdicts from the sizing itself.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`alter table board_sizings add column outcome jsonb;`);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`alter table board_sizings drop column outcome;`);
};
