// Bundles the print worker (features/schedule/print/print-worker.ts and what it imports from
// the app) into one ES module beside the Next build: `<distDir>/print-worker.mjs`, or the path
// given as the first argument. Packages stay imports of node_modules. Run after `next build`
// (`npm run build` does both): next build empties the build folder first.
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

import { build } from 'esbuild';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

/** Writes the bundled worker to `outfile`. */
export async function buildPrintWorker(outfile) {
  await build({
    absWorkingDir: root,
    entryPoints: [path.join(root, 'features/schedule/print/print-worker.ts')],
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

if (import.meta.url === pathToFileURL(process.argv[1]).href) {
  const out = process.argv[2] ?? path.join(root, process.env.NEXT_DIST_DIR || '.next', 'print-worker.mjs');
  await buildPrintWorker(out);
  console.log(`print worker: ${path.relative(root, out)}`);
}
