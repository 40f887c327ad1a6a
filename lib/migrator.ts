import path from 'node:path';
import { pathToFileURL } from 'node:url';

import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug, type MigrationFn } from 'umzug';

type MigrationModule = { up: MigrationFn<QueryInterface>; down: MigrationFn<QueryInterface> };

/** The versioned migrations in migrations/, applied in file-name order. */
export function migrator(sequelize: Sequelize): Umzug<QueryInterface> {
  return new Umzug({
    migrations: {
      glob: ['migrations/*.ts', { cwd: path.resolve(__dirname, '..') }],
      // Loaded with import() so that the TypeScript files run under tsx and vitest alike.
      resolve: ({ name, path: file, context }) => {
        const load = () => import(pathToFileURL(file!).href) as Promise<MigrationModule>;
        return {
          name,
          up: async () => (await load()).up({ name, path: file, context }),
          down: async () => (await load()).down({ name, path: file, context }),
        };
      },
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}
