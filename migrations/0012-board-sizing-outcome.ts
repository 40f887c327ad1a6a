import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// `board_sizings.outcome`: the stored sizing in brief, written with it ({verdicts: way id →
// verdict, worst}, lib/supply sizingOutcome). Re-sizing a site compares every board's new way
// verdicts with the stored ones; reading them from the whole sizing (tens of kB of JSON per
// board, parsed again on every re-size) was most of the time a re-size held the site's lock.
// Null: written before this migration, or the engine refused the board (sizing null); the
// reader then takes the verdicts from the sizing itself.
//
// `board_sizings.sizing` is compressed with lz4 instead of pglz from now on (rows already stored
// keep theirs until rewritten): a re-size stores ten sizings of ~60 kB under the site's lock, and
// lz4 took a third of pglz's time for them (100 sizings: 17 against 52 ms) and stores them smaller
// (5.5 against 7.4 kB each). Debian's PostgreSQL is built with lz4.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    alter table board_sizings add column outcome jsonb;
    alter table board_sizings alter column sizing set compression lz4;
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    alter table board_sizings alter column sizing set compression default;
    alter table board_sizings drop column outcome;
  `);
};
