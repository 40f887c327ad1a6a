// Prints the first-load JavaScript of every page route from the last `next build`
// (Next 16 writes it to .next/diagnostics/route-bundle-stats.json; its build log no longer
// shows sizes). Sizes: raw bytes as shipped, and gzip as a browser would download them.
import fs from 'node:fs';
import zlib from 'node:zlib';

const stats = JSON.parse(fs.readFileSync('.next/diagnostics/route-bundle-stats.json', 'utf8'));
const gz = new Map();
const gzip = (file) => {
  if (!gz.has(file)) gz.set(file, zlib.gzipSync(fs.readFileSync(file)).length);
  return gz.get(file);
};
const kb = (n) => `${(n / 1024).toFixed(0)} kB`;
console.log('First-load JS per route (raw / gzip):');
for (const s of stats.sort((a, b) => a.route.localeCompare(b.route))) {
  const zipped = s.firstLoadChunkPaths.reduce((n, f) => n + gzip(f), 0);
  console.log(`  ${s.route.padEnd(34)} ${kb(s.firstLoadUncompressedJsBytes).padStart(8)} / ${kb(zipped).padStart(7)}`);
}
