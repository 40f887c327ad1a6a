import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// A board's `version` and `updated_at` name one stored state of its design. The database keeps
// them, so that no write path can forget to: every transaction that writes a boards row, or a
// way's place, device or circuit (not its label check, which is the walk's record), raises the
// board's version once and sets `updated_at` to the transaction's time. `stamped_in` is the
// transaction that last raised it.
//
// A board's sizing is stored in `board_sizings`, for the version it was computed from: it is
// current only while that equals the board's version (lib/dal/board-repository.ts writes it
// with every save, and sizes a board whose stored sizing is older when it is read, so boards
// stored before this migration are sized on first read). `sizing` is the engine's answer as
// the route sends it (json keeps the text as written), `issues` the engine's refusal.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    alter table boards add column stamped_in xid8;

    create function boards_stamp() returns trigger language plpgsql as $$
    begin
      if old.stamped_in is distinct from pg_current_xact_id() then
        new.version := greatest(new.version, old.version + 1);
        new.stamped_in := pg_current_xact_id();
      end if;
      new.updated_at := now();
      return new;
    end $$;
    create trigger boards_stamp before update on boards
      for each row execute function boards_stamp();

    create function ways_stamp_board() returns trigger language plpgsql as $$
    begin
      if tg_op = 'INSERT' then
        update boards set updated_at = now() where id in (select board_id from new_ways);
      elsif tg_op = 'DELETE' then
        update boards set updated_at = now() where id in (select board_id from old_ways);
      else
        update boards set updated_at = now() where id in (
          select n.board_id from new_ways n join old_ways o on o.id = n.id
          where (n.board_id, n.rail, n.position, n.device, n.circuit)
            is distinct from (o.board_id, o.rail, o.position, o.device, o.circuit)
          union
          select o.board_id from new_ways n join old_ways o on o.id = n.id where n.board_id <> o.board_id);
      end if;
      return null;
    end $$;
    create trigger ways_insert_stamp after insert on ways referencing new table as new_ways
      for each statement execute function ways_stamp_board();
    create trigger ways_update_stamp after update on ways referencing old table as old_ways new table as new_ways
      for each statement execute function ways_stamp_board();
    create trigger ways_delete_stamp after delete on ways referencing old table as old_ways
      for each statement execute function ways_stamp_board();

    create table board_sizings (
      board_id uuid primary key references boards(id) on delete cascade,
      version integer not null,
      sizing json,
      issues jsonb not null default '[]'
    );
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    drop table board_sizings;
    drop trigger ways_insert_stamp on ways;
    drop trigger ways_update_stamp on ways;
    drop trigger ways_delete_stamp on ways;
    drop function ways_stamp_board();
    drop trigger boards_stamp on boards;
    drop function boards_stamp();
    alter table boards drop column stamped_in;
  `);
};
