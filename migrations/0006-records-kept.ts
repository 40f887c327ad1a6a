import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// Nothing issued can be lost. Sites and boards are archived instead of deleted (a board never
// issued may be deleted, and undeleted, by its designers); an issued revision is never
// changed or removed, nor is a board that has one, nor its comments or photos. The person who
// last changed a board's design is kept (separation of duties at issue), with the issuer's
// typed declaration on each revision, the organisation's self-issue setting, the answered
// state of review comments and withdrawn photos. Existing rows keep their data: the last
// designer is taken from the audit trail, else the board's creator.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    alter table organisations add column allow_self_issue boolean not null default false;

    alter table sites
      add column archived_at timestamptz,
      add column archived_by_id uuid references users(id) on delete set null;

    alter table boards
      add column archived_at timestamptz,
      add column archived_by_id uuid references users(id) on delete set null,
      add column deleted_at timestamptz,
      add column deleted_by_id uuid references users(id) on delete set null,
      add column design_changed_by_id uuid references users(id) on delete set null;
    update boards b set design_changed_by_id = coalesce(
      (select e.user_id from audit_events e
        where e.board_id = b.id and e.action = 'board.saved' and e.user_id is not null
          and exists (select 1 from users u where u.id = e.user_id)
        order by e.id desc limit 1),
      b.created_by_id);

    alter table board_revisions add column declaration varchar(160);

    alter table comments
      add column answered_at timestamptz,
      add column answered_by_id uuid references users(id) on delete set null;

    alter table attachments
      add column withdrawn_at timestamptz,
      add column withdrawn_by_id uuid references users(id) on delete set null;

    -- An issued revision is a record: never changed, never removed
    create function board_revisions_kept() returns trigger language plpgsql as $$
    begin
      raise exception 'issued revisions are kept: board_revisions rows cannot be changed or removed';
    end $$;
    create trigger board_revisions_kept before update or delete on board_revisions
      for each row execute function board_revisions_kept();
    create trigger board_revisions_no_truncate before truncate on board_revisions
      for each statement execute function board_revisions_kept();

    -- A board that was ever issued, and its comments and photos, are never removed
    create function issued_board_rows_kept() returns trigger language plpgsql as $$
    declare
      board uuid;
    begin
      -- Each branch is planned only when it runs: a comments row has no field "id" to mistake
      if tg_table_name = 'boards' then board := old.id; else board := old.board_id; end if;
      if exists (select 1 from board_revisions r where r.board_id = board) then
        raise exception 'board % has an issued revision: its % rows are kept (archive it instead)', board, tg_table_name;
      end if;
      return old;
    end $$;
    create trigger boards_issued_kept before delete on boards
      for each row execute function issued_board_rows_kept();
    create trigger comments_issued_kept before delete on comments
      for each row execute function issued_board_rows_kept();
    create trigger attachments_issued_kept before delete on attachments
      for each row execute function issued_board_rows_kept();

    create index boards_live on boards (organisation_id) where archived_at is null and deleted_at is null;
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    drop index if exists boards_live;
    drop trigger if exists attachments_issued_kept on attachments;
    drop trigger if exists comments_issued_kept on comments;
    drop trigger if exists boards_issued_kept on boards;
    drop function if exists issued_board_rows_kept();
    drop trigger if exists board_revisions_no_truncate on board_revisions;
    drop trigger if exists board_revisions_kept on board_revisions;
    drop function if exists board_revisions_kept();
    alter table attachments drop column withdrawn_at, drop column withdrawn_by_id;
    alter table comments drop column answered_at, drop column answered_by_id;
    alter table board_revisions drop column declaration;
    alter table boards drop column archived_at, drop column archived_by_id, drop column deleted_at,
      drop column deleted_by_id, drop column design_changed_by_id;
    alter table sites drop column archived_at, drop column archived_by_id;
    alter table organisations drop column allow_self_issue;
  `);
};
