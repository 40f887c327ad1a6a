import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// A change upstream in a site's tree (its origin, a sub-main) re-sizes every board below and
// stores at once what the site view, the editors and the boards' history need: the values carried
// to each board, its outcome (way verdicts, worst verdict) and its issues. The whole sizing of a
// board whose sizing changed (tens of kB of JSON each) is stored by the first read that needs it
// instead (lib/dal/site-tree.ts): `pending` says it is still to be stored, and `sizing` is then
// null. `sizing_sha256` is the SHA-256 of the sizing's JSON text as the app made it, stored or
// pending, so that a re-size tells an unchanged sizing without sending or reading the text.
// Rows already stored get no hash (null): their next re-size writes them again.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    alter table board_sizings add column pending boolean not null default false;
    alter table board_sizings add column sizing_sha256 bytea;
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    alter table board_sizings drop column sizing_sha256;
    alter table board_sizings drop column pending;
  `);
};
