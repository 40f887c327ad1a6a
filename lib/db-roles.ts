/**
 * Two database roles: the owner runs the migrations (DATABASE_OWNER_URL) and the app
 * connects as a role that owns nothing (DATABASE_URL). The app role may read and write every
 * table except two: the audit trail, which it may only read and append to, and the
 * migrations table, which it may only read. Owning nothing, it cannot drop or disable the
 * audit trail's triggers either. scripts/migrate.ts gives the grants after every migration.
 */
import type { Sequelize } from 'sequelize';

/** The app's role: the user in DATABASE_URL, or null when there is none. */
export function appRoleOf(url = process.env.DATABASE_URL): string | null {
  if (!url) return null;
  const user = decodeURIComponent(new URL(url).username);
  return user || null;
}

const quoted = (role: string) => `"${role.replaceAll('"', '""')}"`;

/** The grants of the app role in the current database (run as the owner). */
export function appRoleGrantsSql(role: string): string {
  const r = quoted(role);
  return `
    grant usage on schema public to ${r};
    grant select, insert, update, delete on all tables in schema public to ${r};
    grant usage, select on all sequences in schema public to ${r};
    revoke update, delete, truncate on audit_events from ${r};
    revoke insert, update, delete, truncate on schema_migrations from ${r};
    alter default privileges in schema public grant select, insert, update, delete on tables to ${r};
    alter default privileges in schema public grant usage, select on sequences to ${r};
  `;
}

/**
 * The app role, when it is another role than the one connected and it exists on the server;
 * null when the app connects as the owner itself (one role for everything).
 */
export async function separateAppRole(sequelize: Sequelize): Promise<string | null> {
  const role = appRoleOf();
  if (!role) return null;
  const [rows] = (await sequelize.query(
    'select current_user as me, exists (select 1 from pg_roles where rolname = $1) as found',
    { bind: [role] },
  )) as [{ me: string; found: boolean }[], unknown];
  return rows[0].found && rows[0].me !== role ? role : null;
}
