#!/usr/bin/env node
// Measures the single-line diagram of a 30-board site in Debian's chromium (a quick measurement,
// not a test: the issue wants under 100 ms) and takes desktop and phone screenshots of it.
// Run from the project's root: node scripts/site-diagram-bench/run.mjs [out-dir]
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createRequire } from 'node:module';

const require = createRequire(path.join(process.cwd(), 'package.json'));
const esbuild = require('esbuild');
const postcss = require('postcss');
const tailwind = require('@tailwindcss/postcss');
const { chromium } = require('playwright-core');

const out = process.argv[2] ?? fs.mkdtempSync(path.join(os.tmpdir(), 'site-diagram-'));
fs.mkdirSync(out, { recursive: true });
await esbuild.build({
  entryPoints: ['scripts/site-diagram-bench/entry.tsx'],
  bundle: true,
  outfile: path.join(out, 'entry.js'),
  jsx: 'automatic',
  alias: { '@': process.cwd() },
  define: { 'process.env.NODE_ENV': '"production"' },
  minify: true,
  logLevel: 'warning',
});
const css = await postcss([tailwind()]).process(fs.readFileSync('app/globals.css', 'utf8'), {
  from: path.resolve('app/globals.css'),
});
fs.writeFileSync(path.join(out, 'style.css'), css.css);
fs.writeFileSync(
  path.join(out, 'index.html'),
  '<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><link rel="stylesheet" href="style.css"><title>Site diagram</title></head><body class="bg-paper p-3"><div id="root"></div><script src="entry.js"></script></body></html>',
);

const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'shoot-'));
const context = await chromium.launchPersistentContext(profile, {
  executablePath: '/usr/bin/chromium',
  headless: true,
  viewport: { width: 1280, height: 900 },
  args: ['--no-sandbox', '--disable-gpu', '--allow-file-access-from-files'],
});
const page = context.pages()[0] ?? (await context.newPage());
page.on('pageerror', (e) => console.error(String(e)));
await page.goto(`file://${path.join(out, 'index.html')}`);
await page.waitForFunction(() => window.ready === true);
const times = await page.evaluate(() => window.bench(40));
const warm = times.slice(5).sort((a, b) => a - b);
console.log(
  `30 boards: first render ${times[0].toFixed(1)} ms; warm median ${warm[Math.floor(warm.length / 2)].toFixed(1)} ms, max ${warm[warm.length - 1].toFixed(1)} ms (${warm.length} renders)`,
);
const elements = await page.evaluate(() => document.querySelectorAll('#root svg *').length);
const base = (await page.evaluate((count) => window.baseline(40, count), Math.round(elements / 2)))
  .slice(5)
  .sort((a, b) => a - b);
console.log(
  `Baseline (${elements} plain SVG elements, same page): warm median ${base[Math.floor(base.length / 2)].toFixed(1)} ms`,
);
await page.evaluate(() => window.bench(1));
await page.screenshot({ path: path.join(out, 'desktop.png'), clip: { x: 0, y: 0, width: 1280, height: 900 } });
await page.setViewportSize({ width: 390, height: 844 });
await page.screenshot({ path: path.join(out, 'phone.png') });
console.log(`Screenshots in ${out}`);
await context.close();
fs.rmSync(profile, { recursive: true, force: true });
