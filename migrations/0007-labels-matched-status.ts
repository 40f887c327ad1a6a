import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// The stage reached when every label on site matches the schedule was called `verified`, which
// reads as "inspected and tested". It is renamed in the boards' status enum: every stored board
// keeps its stage under the new name. The audit trail keeps its old events as written
// (it is append-only); the change history reads both names.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`alter type enum_boards_status rename value 'verified' to 'labels-matched'`);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`alter type enum_boards_status rename value 'labels-matched' to 'verified'`);
};
