import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// Counters of failed sign-ins, shared by every app instance (rate-limiter-flexible's layout).
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    create table sign_in_limits (
      key varchar(255) primary key,
      points integer not null default 0,
      expire bigint
    );
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('drop table if exists sign_in_limits;');
};
