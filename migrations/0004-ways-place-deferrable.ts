import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// A way's place on a rail stays unique, checked at commit: a save that moves ways around
// can write them in any order without first shuffling them out of each other's way.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    alter table ways drop constraint ways_board_id_rail_position_key;
    alter table ways add constraint ways_board_id_rail_position_key
      unique (board_id, rail, position) deferrable initially deferred;
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    alter table ways drop constraint ways_board_id_rail_position_key;
    alter table ways add constraint ways_board_id_rail_position_key unique (board_id, rail, position);
  `);
};
