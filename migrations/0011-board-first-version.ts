import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// A new board's first stored state is version 1. The transaction that inserts a boards row
// counts as its first stamp (migration 0008's boards_stamp raises the version once per
// transaction, and only for a transaction other than the one in `stamped_in`), so ways
// inserted with the board in the same transaction leave it at version 1.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    create function boards_stamp_insert() returns trigger language plpgsql as $$
    begin
      new.stamped_in := pg_current_xact_id();
      return new;
    end $$;
    create trigger boards_stamp_insert before insert on boards
      for each row execute function boards_stamp_insert();
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    drop trigger boards_stamp_insert on boards;
    drop function boards_stamp_insert();
  `);
};
