/**
 * Local stand-ins for the hosted services, in one process:
 * - an SMTP catcher (smtp-server) that keeps every message it receives and lists them
 *   over HTTP (GET /messages, DELETE /messages) for the admin mailbox page and the tests;
 * - an S3-compatible object store (s3rver) with the app's bucket created at start.
 * Started by scripts/services.sh; settings come from scripts/env.sh.
 */
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';

import { simpleParser } from 'mailparser';
import S3rver from 's3rver';
import { SMTPServer } from 'smtp-server';

const dataDir = process.env.DATA_DIR ?? path.join(process.cwd(), '.data');
const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
const catcherUrl = new URL(process.env.MAIL_CATCHER_URL ?? 'http://127.0.0.1:2526');
const s3Port = Number(process.env.S3_PORT ?? 4569);
const bucket = process.env.S3_BUCKET ?? 'boardwright';
const mailDir = path.join(dataDir, `mail-${smtpPort}`);
fs.mkdirSync(mailDir, { recursive: true });

type Caught = {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  attachments: { filename: string; contentType: string; size: number }[];
};

/** Messages are kept as one JSON file each so they survive a restart of the catcher. */
function readAll(): Caught[] {
  return fs
    .readdirSync(mailDir)
    .filter((f) => f.endsWith('.json'))
    .sort()
    .map((f) => JSON.parse(fs.readFileSync(path.join(mailDir, f), 'utf8')) as Caught);
}

const smtp = new SMTPServer({
  authOptional: true,
  // The package's built-in certificate has expired; plain SMTP on loopback only.
  disabledCommands: ['STARTTLS', 'AUTH'],
  logger: false,
  size: 25 * 1024 * 1024,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const id = `${Date.now()}-${Math.random().toString(36).slice(2, 8)}`;
        const to = session.envelope.rcptTo.map((r) => r.address);
        const caught: Caught = {
          id,
          receivedAt: new Date().toISOString(),
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to,
          subject: mail.subject ?? '',
          text: mail.text ?? '',
          html: typeof mail.html === 'string' ? mail.html : '',
          attachments: mail.attachments.map((a) => ({
            filename: a.filename ?? '',
            contentType: a.contentType,
            size: a.size,
          })),
        };
        fs.writeFileSync(path.join(mailDir, `${id}.json`), JSON.stringify(caught));
        callback();
      })
      .catch((err: Error) => callback(err));
  },
});

const api = http.createServer((req, res) => {
  if (req.url?.startsWith('/messages') && req.method === 'GET') {
    res.setHeader('content-type', 'application/json');
    res.end(JSON.stringify(readAll().reverse()));
    return;
  }
  if (req.url?.startsWith('/messages') && req.method === 'DELETE') {
    for (const f of fs.readdirSync(mailDir)) fs.rmSync(path.join(mailDir, f));
    res.statusCode = 204;
    res.end();
    return;
  }
  if (req.url === '/health') {
    res.end('ok');
    return;
  }
  res.statusCode = 404;
  res.end();
});

const s3 = new S3rver({
  address: '127.0.0.1',
  port: s3Port,
  silent: true,
  directory: path.join(dataDir, `s3-${s3Port}`),
  configureBuckets: [{ name: bucket, configs: [] }],
});

async function main() {
  await new Promise<void>((resolve) => smtp.listen(smtpPort, '127.0.0.1', resolve));
  await new Promise<void>((resolve) => api.listen(Number(catcherUrl.port), catcherUrl.hostname, resolve));
  await s3.run();
  console.log(
    `fakes up: SMTP 127.0.0.1:${smtpPort}, mailbox ${catcherUrl.href}messages, S3 127.0.0.1:${s3Port}/${bucket}`,
  );
}

function shutdown() {
  smtp.close(() => undefined);
  api.close();
  void s3.close().finally(() => process.exit(0));
  setTimeout(() => process.exit(0), 2000).unref();
}
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);

main().catch((err) => {
  console.error('fakes failed to start:', err);
  process.exit(1);
});
