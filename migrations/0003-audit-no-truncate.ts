import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// Row triggers do not fire on TRUNCATE: refuse that too, so the trail cannot be emptied.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    create trigger audit_events_no_truncate before truncate on audit_events
      for each statement execute function audit_events_append_only();
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('drop trigger if exists audit_events_no_truncate on audit_events;');
};
