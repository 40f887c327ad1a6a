import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// What the review page shows of a stored sizing (each way's figures and verdict, the board's
// summary and its failing checks), stored beside the sizing when it is written whole
// (lib/boards/review-page-data.ts reviewSizingOf), so that the page's read does not parse the
// whole sizing (about 50 kB of JSON for a board of 36 ways). A row with a sizing and without its
// cut is not current (lib/dal/board-repository.ts CURRENT_SIZING): its first read sizes the
// board (or its site's tree) again and stores both.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('alter table board_sizings add column review jsonb');
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('alter table board_sizings drop column review');
};
