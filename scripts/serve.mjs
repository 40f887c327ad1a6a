// Runs the production server (`next start`, same arguments) in one process per core, all
// listening on the one port: Node's cluster module hands each connection to a worker. A
// worker that dies is replaced. Workers pass cache invalidations to each other through the
// primary (lib/auth/session.ts, forgetActor). WEB_CONCURRENCY sets the number of workers.
import cluster from 'node:cluster';
import os from 'node:os';

const workers = Math.max(1, Number(process.env.WEB_CONCURRENCY) || os.availableParallelism());

if (cluster.isPrimary && workers > 1) {
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
  cluster.on('exit', (worker, code, signal) => {
    if (stopping) return;
    console.error(`[serve] worker ${worker.process.pid} ended (${signal ?? code}); starting another`);
    cluster.fork();
  });
  for (let i = 0; i < workers; i++) cluster.fork();
} else {
  process.argv = [process.argv[0], 'next', 'start', ...process.argv.slice(2)];
  await import('next/dist/bin/next');
}
