// Bundles the server's worker threads, each with what it imports from the app, into one ES module
// beside the Next build: the print worker (features/schedule/print/print-worker.ts) as
// `<distDir>/print-worker.mjs` and the presize worker (lib/sites/presize-worker.ts) as
// `<distDir>/presize-worker.mjs`. Packages stay imports of node_modules. Run after `next build`
// (`npm run build` does both): next build empties the build folder first.
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

import { build } from 'esbuild';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

/** Bundles the worker `entry` (a path from the project's root) into `outfile`. */
async function buildWorker(entry, outfile) {
  await build({
    absWorkingDir: root,
    entryPoints: [path.join(root, entry)],
    outfile,
    bundle: true,
    platform: 'node',
    target: 'node20',
    format: 'esm',
    packages: 'external',
    jsx: 'automatic',
    tsconfig: path.join(root, 'tsconfig.json'),
    define: { 'process.env.NODE_ENV': '"production"' },
    logLevel: 'warning',
  });
  return outfile;
}

/** Writes the bundled print worker to `outfile`. */
export const buildPrintWorker = (outfile) => buildWorker('features/schedule/print/print-worker.ts', outfile);

/** Writes the bundled presize worker to `outfile`. */
export const buildPresizeWorker = (outfile) => buildWorker('lib/sites/presize-worker.ts', outfile);

if (import.meta.url === pathToFileURL(process.argv[1]).href) {
  const dist = path.join(root, process.env.NEXT_DIST_DIR || '.next');
  for (const out of [
    await buildPrintWorker(path.join(dist, 'print-worker.mjs')),
    await buildPresizeWorker(path.join(dist, 'presize-worker.mjs')),
  ]) {
    console.log(`worker: ${path.relative(root, out)}`);
  }
}
