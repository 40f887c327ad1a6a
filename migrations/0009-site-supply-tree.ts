import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// A site is one supply tree (its method: `sizeSite`, lib/supply/size-site.ts).
//
// - `sites.origin`: the supply intake of the site, as JSON {earthing, uoV, zeOhm, pfcKa, source}
//   (validated by lib/sites/tree-types.ts siteOriginSchema). Null: not given yet; then each board
//   fed from the origin is sized with its own typed supply, as before this migration.
// - `sites.tree_version`: raised by every write that changes what is carried down the tree (an
//   origin change, a board's design or feed); each stored sizing records the tree version it
//   was carried with (`board_sizings.tree_version`), so a sizing against a stale parent is seen.
// - `boards.fed_from_way_id`: the way of another board of the same site that feeds this board
//   (a sub-main); null: fed from the origin. A deleted way sets it null (the app asks first and
//   records it; this is the database's safety net).
// - `boards.sub_main_design_current_a` and `..._reason`: the designer's design current for the
//   sub-main feeding this board, with the reason (both or neither).
// - `boards.upstream_rcd_time_delayed`: whether the RCD protecting the sub-main above is type S.
// - `board_sizings.carried`: what was carried down to the board when it was sized (the
//   derived supply with its working, lib/sites/tree-types.ts DerivedSupply); null: typed supply.
//
// Today's boards become "fed from the origin"; each site with boards gets its first board's
// typed supply values as its origin (the first live board by creation). A board whose typed
// values differ from that origin keeps them in its row (boards.supply is not changed, so the
// down migration loses nothing) and its history gets a note saying which values it had and that
// the site's origin is used from now on.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    alter table sites
      add column origin jsonb,
      add column tree_version integer not null default 0,
      add constraint sites_origin_shape check (origin is null or (
        jsonb_typeof(origin) = 'object' and origin ? 'earthing' and origin ? 'uoV'
        and origin ? 'zeOhm' and origin ? 'pfcKa' and origin ? 'source'));

    alter table boards
      add column fed_from_way_id uuid references ways(id) on delete set null,
      add column sub_main_design_current_a numeric(10, 2),
      add column sub_main_design_current_reason text,
      add column upstream_rcd_time_delayed boolean not null default false,
      add constraint boards_sub_main_override_pair check (
        (sub_main_design_current_a is null) = (sub_main_design_current_reason is null));
    create index boards_fed_from_way on boards (fed_from_way_id) where fed_from_way_id is not null;

    alter table board_sizings
      add column carried jsonb,
      add column tree_version integer;

    -- Each site's origin: its first board's typed supply (live boards first, then by creation)
    update sites s set origin = jsonb_build_object(
        'earthing', f.supply->'earthing', 'uoV', coalesce(f.supply->'uoV', '230'::jsonb),
        'zeOhm', f.supply->'zeOhm', 'pfcKa', f.supply->'pfcKa',
        'source', coalesce(f.supply->'source', '"public"'::jsonb))
    from (
      select distinct on (b.site_id) b.site_id, b.supply::jsonb as supply
      from boards b
      order by b.site_id, (b.deleted_at is not null), b.created_at, b.id
    ) f
    where f.site_id = s.id;

    -- A board whose typed values differ from its site's origin: a note in its history
    insert into audit_events (organisation_id, board_id, user_id, action, details)
    select b.organisation_id, b.id, null, 'board.supply-origin', jsonb_build_object(
        'typed', b.supply::jsonb, 'origin', s.origin,
        'note', 'This board is now fed from the site''s origin, whose values were taken from the site''s first board; '
          || 'the supply values typed on this board are kept in its record.')
    from boards b join sites s on s.id = b.site_id
    where s.origin is not null and (
      (b.supply::jsonb->'earthing') is distinct from (s.origin->'earthing')
      or coalesce(b.supply::jsonb->'uoV', '230'::jsonb) is distinct from (s.origin->'uoV')
      or (b.supply::jsonb->'zeOhm') is distinct from (s.origin->'zeOhm')
      or (b.supply::jsonb->'pfcKa') is distinct from (s.origin->'pfcKa')
      or coalesce(b.supply::jsonb->'source', '"public"'::jsonb) is distinct from (s.origin->'source'));
  `);
};

// The boards' typed supply values were never changed, so dropping the columns loses no board's
// values; the history notes stay (the audit trail is append-only).
export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    alter table board_sizings drop column carried, drop column tree_version;
    drop index if exists boards_fed_from_way;
    alter table boards
      drop constraint boards_sub_main_override_pair,
      drop column fed_from_way_id,
      drop column sub_main_design_current_a,
      drop column sub_main_design_current_reason,
      drop column upstream_rcd_time_delayed;
    alter table sites drop constraint sites_origin_shape, drop column origin, drop column tree_version;
  `);
};
