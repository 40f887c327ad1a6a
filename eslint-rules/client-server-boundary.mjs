// A rule of the project's own: a 'use client' module, and every project module it reaches
// through its imports (type-only imports included), never reaches a server-only module.
// ESLint's and eslint-plugin-import's path rules match files by name; whether a file is
// client code is written inside it (the directive), so this rule reads the import graph.
// Server-only: lib/dal/**, lib/db.ts, models/**, and any module that imports 'server-only'.
// A 'use server' module (server actions) is a boundary the client may call through.
import fs from 'node:fs';
import path from 'node:path';
import ts from 'typescript';

const SERVER_PATHS = [/^lib\/dal\//, /^lib\/db\.ts$/, /^models\//];
const EXTENSIONS = ['.ts', '.tsx', '.mts', '.js', '.mjs', '/index.ts', '/index.tsx'];

/** The project file a specifier names, or null for a package or a file that is not there. */
function resolve(root, fromFile, specifier) {
  let base;
  if (specifier.startsWith('@/')) base = path.join(root, specifier.slice(2));
  else if (specifier.startsWith('./') || specifier.startsWith('../'))
    base = path.resolve(path.dirname(fromFile), specifier);
  else return null;
  for (const candidate of [base, ...EXTENSIONS.map((e) => base + e)]) {
    try {
      if (fs.statSync(candidate).isFile()) return candidate;
    } catch {
      // not this candidate
    }
  }
  return null;
}

function directiveOf(text) {
  const m = /^(?:\s|\/\/[^\n]*\n|\/\*[\s\S]*?\*\/)*(['"])use (client|server)\1/.exec(text);
  return m ? m[2] : null;
}

const cache = new Map();

/** What the rule needs of one module: its kind and the project files it imports. */
function moduleInfo(root, file) {
  let stat;
  try {
    stat = fs.statSync(file);
  } catch {
    return null;
  }
  const hit = cache.get(file);
  if (hit && hit.mtimeMs === stat.mtimeMs) return hit;
  const text = fs.readFileSync(file, 'utf8');
  const specifiers = ts.preProcessFile(text, true, true).importedFiles.map((f) => f.fileName);
  const rel = path.relative(root, file).split(path.sep).join('/');
  const info = {
    mtimeMs: stat.mtimeMs,
    rel,
    directive: directiveOf(text),
    serverOnly: SERVER_PATHS.some((re) => re.test(rel)) || specifiers.includes('server-only'),
    imports: [...new Set(specifiers.map((s) => resolve(root, file, s)).filter(Boolean))],
  };
  cache.set(file, info);
  return info;
}

/** The chain of files from `start` to the first server-only module it reaches, or null. */
function serverChain(root, start) {
  const first = moduleInfo(root, start);
  if (!first) return null;
  const seen = new Set([start]);
  const queue = [[start]];
  while (queue.length) {
    const chain = queue.shift();
    const info = moduleInfo(root, chain[chain.length - 1]);
    if (!info) continue;
    if (info.serverOnly) return chain.map((f) => moduleInfo(root, f).rel);
    // Another client module is checked on its own; a server action is the allowed way in.
    if (info.directive) continue;
    for (const next of info.imports) {
      if (seen.has(next)) continue;
      seen.add(next);
      queue.push([...chain, next]);
    }
  }
  return null;
}

export const clientServerBoundary = {
  meta: {
    type: 'problem',
    docs: { description: "Client code ('use client' and what it imports) never imports a server-only module" },
    schema: [],
    messages: {
      server:
        "Client module imports {{chain}}: server-only code (lib/dal, lib/db.ts, models, 'server-only'). " +
        'Move what the client needs (types included) to a module the browser may load, e.g. a lib/ schema.',
    },
  },
  create(context) {
    const root = context.cwd;
    const file = context.filename;
    const text = context.sourceCode.text;
    if (directiveOf(text) !== 'client') return {};
    function check(node) {
      const source = node.source;
      if (!source || source.type !== 'Literal' || typeof source.value !== 'string') return;
      const target = resolve(root, file, source.value);
      if (!target) return;
      const chain = serverChain(root, target);
      if (chain) context.report({ node: source, messageId: 'server', data: { chain: chain.join(' → ') } });
    }
    return {
      ImportDeclaration: check,
      ExportNamedDeclaration: check,
      ExportAllDeclaration: check,
      ImportExpression: check,
    };
  },
};

const plugin = { meta: { name: 'boardwright' }, rules: { 'client-server-boundary': clientServerBoundary } };
export default plugin;
