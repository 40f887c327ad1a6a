import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// The first schema: organisations, people, sites, boards and everything hanging off them.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    create type enum_users_role as enum ('admin', 'designer', 'inspector', 'installer');
    create type enum_invitations_role as enum ('admin', 'designer', 'inspector', 'installer');
    create type enum_boards_status as enum ('draft', 'in-review', 'issued', 'verified');
    create type enum_ways_label_status as enum ('unchecked', 'matches', 'wrong', 'missing');
    create type enum_outgoing_mail_status as enum ('queued', 'sent', 'failed');

    create table organisations (
      id uuid primary key,
      name varchar(160) not null,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now()
    );

    create table users (
      id uuid primary key,
      organisation_id uuid not null references organisations(id) on delete cascade,
      email varchar(254) not null,
      name varchar(120) not null,
      password_hash varchar(100),
      role enum_users_role not null,
      active boolean not null default true,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now()
    );
    create unique index users_email_unique on users (lower(email));
    create index users_organisation on users (organisation_id);

    create table invitations (
      id uuid primary key,
      organisation_id uuid not null references organisations(id) on delete cascade,
      email varchar(254) not null,
      name varchar(120) not null,
      role enum_invitations_role not null,
      token_hash varchar(64) not null unique,
      expires_at timestamptz not null,
      accepted_at timestamptz,
      invited_by_id uuid not null references users(id),
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now()
    );

    create table sites (
      id uuid primary key,
      organisation_id uuid not null references organisations(id) on delete cascade,
      name varchar(160) not null,
      address varchar(300) not null default '',
      client varchar(160) not null default '',
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now()
    );
    create index sites_organisation on sites (organisation_id);

    create table boards (
      id uuid primary key,
      organisation_id uuid not null references organisations(id) on delete cascade,
      site_id uuid not null references sites(id) on delete cascade,
      name varchar(160) not null,
      location varchar(200) not null default '',
      phases smallint not null check (phases in (1, 3)),
      supply jsonb not null,
      incoming jsonb not null,
      enclosure_modules smallint not null check (enclosure_modules between 4 and 400),
      rails smallint not null default 1 check (rails between 1 and 12),
      dwelling boolean not null default false,
      status enum_boards_status not null default 'draft',
      version integer not null default 1,
      revision integer not null default 1,
      created_by_id uuid references users(id) on delete set null,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now()
    );
    create index boards_organisation on boards (organisation_id);
    create index boards_site on boards (site_id);

    create table ways (
      id uuid primary key,
      board_id uuid not null references boards(id) on delete cascade,
      rail smallint not null default 0,
      position integer not null,
      device jsonb not null,
      circuit jsonb,
      label_status enum_ways_label_status not null default 'unchecked',
      label_note text not null default '',
      label_checked_by_id uuid references users(id) on delete set null,
      label_checked_at timestamptz,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (board_id, rail, position)
    );

    create table board_revisions (
      id uuid primary key,
      board_id uuid not null references boards(id) on delete cascade,
      revision integer not null,
      snapshot jsonb not null,
      sizing jsonb not null,
      issued_by_id uuid not null references users(id),
      issued_at timestamptz not null default now(),
      unique (board_id, revision)
    );

    create table comments (
      id uuid primary key,
      board_id uuid not null references boards(id) on delete cascade,
      way_id uuid,
      revision integer not null,
      author_id uuid not null references users(id),
      body text not null,
      created_at timestamptz not null default now()
    );
    create index comments_board on comments (board_id);

    create table attachments (
      id uuid primary key,
      organisation_id uuid not null references organisations(id) on delete cascade,
      board_id uuid not null references boards(id) on delete cascade,
      way_id uuid,
      storage_key varchar(300) not null,
      thumb_key varchar(300),
      content_type varchar(100) not null,
      size_bytes integer not null,
      file_name varchar(200) not null default '',
      uploaded_by_id uuid not null references users(id),
      created_at timestamptz not null default now()
    );
    create index attachments_board on attachments (board_id);

    create table audit_events (
      id bigserial primary key,
      organisation_id uuid not null,
      board_id uuid,
      user_id uuid,
      action varchar(60) not null,
      details jsonb not null default '{}',
      created_at timestamptz not null default now()
    );
    create index audit_events_board on audit_events (board_id, id);

    -- The audit trail is append-only: the app may insert, never change or remove.
    create function audit_events_append_only() returns trigger language plpgsql as $$
    begin
      raise exception 'audit_events is append-only';
    end $$;
    create trigger audit_events_no_update before update or delete on audit_events
      for each row execute function audit_events_append_only();

    create table outgoing_mail (
      id uuid primary key,
      organisation_id uuid references organisations(id) on delete set null,
      to_address varchar(254) not null,
      subject varchar(300) not null,
      text_body text not null,
      attachments jsonb not null default '[]',
      status enum_outgoing_mail_status not null default 'queued',
      attempts integer not null default 0,
      last_error text,
      next_attempt_at timestamptz not null default now(),
      sent_at timestamptz,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now()
    );
    create index outgoing_mail_due on outgoing_mail (status, next_attempt_at);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    drop table if exists outgoing_mail, audit_events, attachments, comments, board_revisions,
      ways, boards, sites, invitations, users, organisations cascade;
    drop function if exists audit_events_append_only();
    drop type if exists enum_users_role, enum_invitations_role, enum_boards_status,
      enum_ways_label_status, enum_outgoing_mail_status;
  `);
};
