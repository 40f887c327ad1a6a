// ESLint (flat config): Next.js's rules (React, hooks, accessibility, @next/next, import),
// typescript-eslint's recommended rules, and the project's import boundaries.
// `npm run lint` runs it with no warnings allowed; `npm test` runs that first.
import fs from 'node:fs';
import { defineConfig, globalIgnores } from 'eslint/config';
import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';
import prettier from 'eslint-config-prettier/flat';
import boardwright from './eslint-rules/client-server-boundary.mjs';

const features = fs
  .readdirSync(new URL('./features', import.meta.url), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => d.name);

// Layers, highest first: app → features → components → lib → models. A layer imports only
// from layers below it. lib/ holds two kinds of module: the shared, pure ones (domain
// constants, schemas, names, the sizing engine), which models may use for their attribute
// types, and the server's services over the models (data access, database, auth, mail,
// storage, the route wrapper), which models never import.
const LIB_SERVICES = ['./lib/dal', './lib/db.ts', './lib/auth', './lib/mail', './lib/storage', './lib/api'];
const zones = [
  {
    target: './models',
    from: ['./app', './features', './components', ...LIB_SERVICES],
    message: 'models are the lowest layer.',
  },
  {
    target: './lib',
    from: ['./app', './features', './components'],
    message: 'lib never imports app, features or components.',
  },
  { target: './components', from: ['./app', './features'], message: 'shared components never import app or features.' },
  { target: './features', from: './app', message: 'features never import app: compose features in app/.' },
  {
    target: './lib/sizing',
    from: [...LIB_SERVICES, './lib/forms', './models'],
    message: 'the sizing engine is pure: no data access, database, auth, mail, storage, forms or models.',
  },
  ...features.map((name) => ({
    target: `./features/${name}`,
    from: './features',
    except: [`./${name}`],
    message:
      'features never import each other: compose them in app/, or move the shared part down to components/ or lib/.',
  })),
];

const ONLY_REPOSITORY =
  'the boards, ways and board_sizings tables are read and written only in lib/dal/board-repository.ts: add a named function there.';
// SQL naming one of those tables (the statement's table, not a column or an alias)
const BOARD_TABLES_SQL = String.raw`/\b(?:from|join|update|into|table)\s+(?:boards|ways|board_sizings)\b/i`;

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  globalIgnores([
    // generated or installed
    '.next*/**',
    'next-env.d.ts',
    'coverage/**',
    'test-results/**',
    // local data: the PostgreSQL cluster, mail and object stores, backups, scratch files
    '.data/**',
    '.scratch/**',
  ]),
  {
    name: 'boardwright/rules',
    plugins: { boardwright },
    rules: {
      'import/no-restricted-paths': ['error', { zones }],
      'boardwright/client-server-boundary': 'error',
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_' },
      ],
      '@typescript-eslint/no-unused-expressions': 'error',
      // A type-only import says so (`import type`, or `type` inline): the bundler drops it.
      '@typescript-eslint/consistent-type-imports': [
        'error',
        { fixStyle: 'inline-type-imports', disallowTypeAnnotations: false },
      ],
      // These two only report what the React Compiler would skip; the app does not enable it.
      'react-hooks/incompatible-library': 'off',
      'react-hooks/preserve-manual-memoization': 'off',
    },
  },
  {
    // lib/dal/board-repository.ts is the one module that reads or writes the boards and ways
    // tables and the boards' stored sizings: no other module of the app imports their models
    // or names them in SQL.
    name: 'boardwright/board-repository',
    files: ['app/**', 'features/**', 'components/**', 'lib/**'],
    ignores: ['lib/dal/board-repository.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: [
            { name: '@/models', importNames: ['Board', 'Way'], message: ONLY_REPOSITORY },
            { name: '@/models/board', importNames: ['Board'], message: ONLY_REPOSITORY },
            { name: '@/models/way', importNames: ['Way'], message: ONLY_REPOSITORY },
          ],
        },
      ],
      'no-restricted-syntax': [
        'error',
        { selector: `Literal[value=${BOARD_TABLES_SQL}]`, message: ONLY_REPOSITORY },
        { selector: `TemplateElement[value.raw=${BOARD_TABLES_SQL}]`, message: ONLY_REPOSITORY },
      ],
    },
  },
  {
    name: 'boardwright/tests-and-scripts',
    files: ['tests/**', 'scripts/**', 'migrations/**'],
    rules: {
      // tests and scripts sit outside the layers and may import anything they check
      'import/no-restricted-paths': 'off',
    },
  },
  {
    name: 'boardwright/disable-comments',
    // An eslint-disable comment that silences nothing (or names a rule that is not on) fails.
    linterOptions: { reportUnusedDisableDirectives: 'error' },
  },
  // Last: turns off the stylistic rules Prettier owns.
  prettier,
]);
