import path from 'node:path';

import { ESLint } from 'eslint';
import { beforeAll, describe, expect, it, vi } from 'vitest';

// The import boundaries of eslint.config.mjs, checked through ESLint itself on small probe
// sources placed (by name only; nothing is written) in each layer of this repository.
const root = path.resolve(import.meta.dirname, '../../..');
let eslint: ESLint;

// Loading the config, its plugins and the TypeScript resolver takes seconds on a busy machine.
vi.setConfig({ testTimeout: 30_000 });
beforeAll(async () => {
  eslint = new ESLint({ cwd: root });
  await eslint.lintText('export {};\n', { filePath: path.join(root, 'lib/probe.ts') });
}, 60_000);

async function rulesHit(file: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
  return result.messages.map((m) => m.ruleId ?? m.message);
}

describe('layers: app → features → components → lib → models', () => {
  it('a shared component may not import a feature', async () => {
    const code =
      "import { BoardsTable } from '@/features/boards/components/boards-table';\nexport const x = BoardsTable;\n";
    expect(await rulesHit('components/ui/probe.tsx', code)).toContain('import/no-restricted-paths');
  });

  it('lib may not import a component, and a component may import lib', async () => {
    const up = "import { Button } from '@/components/ui/button';\nexport const x = Button;\n";
    expect(await rulesHit('lib/probe.ts', up)).toContain('import/no-restricted-paths');
    const down = "import { cn } from '@/lib/cn';\nexport const x = cn;\n";
    expect(await rulesHit('components/ui/probe.tsx', down)).toEqual([]);
  });

  it("models may use lib's shared constants but not the data access layer", async () => {
    const shared = "import { ROLES } from '@/lib/domain';\nexport const x = ROLES;\n";
    expect(await rulesHit('models/probe.ts', shared)).toEqual([]);
    const dal = "import { listSites } from '@/lib/dal/sites';\nexport const x = listSites;\n";
    expect(await rulesHit('models/probe.ts', dal)).toContain('import/no-restricted-paths');
  });
});

describe('the sizing engine stays pure', () => {
  it('may use lib/names.ts but not the data access layer', async () => {
    const names = "import { DEVICE_NAMES } from '@/lib/names';\nexport const x = DEVICE_NAMES;\n";
    expect(await rulesHit('lib/sizing/probe.ts', names)).toEqual([]);
    const dal = "import { listSites } from '@/lib/dal/sites';\nexport const x = listSites;\n";
    expect(await rulesHit('lib/sizing/probe.ts', dal)).toContain('import/no-restricted-paths');
  });
});

describe('features never import each other', () => {
  it('another feature is refused, the same feature is not', async () => {
    const other =
      "import { BoardsTable } from '@/features/boards/components/boards-table';\nexport const x = BoardsTable;\n";
    expect(await rulesHit('features/sites/components/probe.tsx', other)).toContain('import/no-restricted-paths');
    const own = "import { SitesTable } from '@/features/sites/components/sites-table';\nexport const x = SitesTable;\n";
    expect(await rulesHit('features/sites/components/probe.tsx', own)).not.toContain('import/no-restricted-paths');
  });
});

describe('client code never imports server-only modules', () => {
  it('a client module importing a type from the data access layer is refused', async () => {
    const code = "'use client';\nimport type { SiteSummary } from '@/lib/dal/sites';\nexport type X = SiteSummary;\n";
    expect(await rulesHit('components/ui/probe.tsx', code)).toContain('boardwright/client-server-boundary');
  });

  it('the same import in a server module is allowed', async () => {
    const code = "import type { SiteSummary } from '@/lib/dal/sites';\nexport type X = SiteSummary;\n";
    expect(await rulesHit('app/(app)/probe.tsx', code)).not.toContain('boardwright/client-server-boundary');
  });

  it('a server-only module reached through another module is refused, and the chain is named', async () => {
    // lib/mail/outbox.ts imports the models and 'server-only'.
    const code = "'use client';\nimport { enqueueMail } from '@/lib/mail/outbox';\nexport const x = enqueueMail;\n";
    const [result] = await eslint.lintText(code, { filePath: path.join(root, 'components/ui/probe.tsx') });
    const hit = result.messages.find((m) => m.ruleId === 'boardwright/client-server-boundary');
    expect(hit?.message).toContain('lib/mail/outbox.ts');
    // a module the browser may load passes
    const fine = "'use client';\nimport { ROLES } from '@/lib/domain';\nexport const x = ROLES;\n";
    expect(await rulesHit('components/ui/probe.tsx', fine)).toEqual([]);
  });
});

describe('only the board repository reads or writes boards, ways and their stored sizings', () => {
  it('the Board and Way models are refused outside lib/dal/board-repository.ts, types included', async () => {
    const value = "import { Board } from '@/models';\nexport const x = () => Board.count();\n";
    expect(await rulesHit('lib/dal/probe.ts', value)).toContain('no-restricted-imports');
    expect(await rulesHit('app/api/probe/route.ts', value)).toContain('no-restricted-imports');
    const type = "import { type Way } from '@/models';\nexport type X = Way;\n";
    expect(await rulesHit('lib/dal/probe.ts', type)).toContain('no-restricted-imports');
    const way = "import { Way } from '@/models/way';\nexport const x = Way;\n";
    expect(await rulesHit('features/walk-probe.ts', way)).toContain('no-restricted-imports');
    // other models, and the status types of those modules, stay open
    const others =
      "import { Site } from '@/models';\nimport type { BoardStatus } from '@/models/board';\nexport const x = Site;\nexport type S = BoardStatus;\n";
    expect(await rulesHit('lib/dal/probe.ts', others)).toEqual([]);
  });

  it('SQL naming one of those tables is refused outside it, in strings and templates', async () => {
    const update = "export const sql = 'UPDATE boards SET status = $2 WHERE id = $1';\n";
    expect(await rulesHit('lib/dal/probe.ts', update)).toContain('no-restricted-syntax');
    const join = 'export const sql = `SELECT 1 FROM sites s\n  JOIN ways w ON w.site_id = s.id`;\n';
    expect(await rulesHit('lib/probe.ts', join)).toContain('no-restricted-syntax');
    const sizings = "export const sql = 'INSERT INTO board_sizings (board_id) VALUES ($1)';\n";
    expect(await rulesHit('lib/dal/site-tree.ts', sizings)).toContain('no-restricted-syntax');
    const words = "export const text = 'Send boards for review; count the ways';\n";
    expect(await rulesHit('lib/probe.ts', words)).toEqual([]);
  });

  it('the repository itself may do both', async () => {
    const code =
      "import { Board } from '@/models';\nexport const x = Board;\nexport const sql = 'SELECT 1 FROM boards b JOIN ways w ON w.board_id = b.id';\n";
    expect(await rulesHit('lib/dal/board-repository.ts', code)).toEqual([]);
  });
});

describe('disable comments', () => {
  it('one that names a rule the config does not know fails', async () => {
    const code = '// eslint-disable-next-line no-such-plugin/no-such-rule\nexport const x = 1;\n';
    const [result] = await eslint.lintText(code, { filePath: path.join(root, 'lib/probe.ts') });
    expect(result.errorCount).toBeGreaterThan(0);
  });

  it('one that silences nothing fails', async () => {
    const code = '// eslint-disable-next-line @typescript-eslint/no-explicit-any\nexport const x = 1;\n';
    const [result] = await eslint.lintText(code, { filePath: path.join(root, 'lib/probe.ts') });
    expect(result.errorCount).toBeGreaterThan(0);
  });
});
