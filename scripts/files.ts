/**
 * scripts/files.ts backup DIR | restore DIR — the app's files in object storage (S3_BUCKET of
 * scripts/env.sh: photos and their thumbnails), copied to a folder and put back.
 *
 * backup: every object of the bucket into DIR/objects/<key>, with DIR/manifest.json naming each
 * key, its size, SHA-256 and type. Stored prints (`prints/`) are left out: each is a render of a
 * revision held in the database, rendered again when it is missing. The folder is written under
 * DIR.partial and takes its name only once complete; an existing DIR is never overwritten.
 * restore: checks every file against the manifest first (a changed or missing one stops the
 * restore before anything is put), then puts each object back under its key.
 * scripts/backup.sh runs the backup beside its database dump (FILE.files).
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

import { GetObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';

import { env } from '@/lib/env';
import { s3Config } from '@/lib/storage/s3-config';

type Entry = { key: string; bytes: number; sha256: string; contentType: string };
type Manifest = { bucket: string; madeAt: string; objects: Entry[] };

/** Renders kept to spare a render: not records, not backed up. */
const SKIPPED_PREFIX = 'prints/';

const sha256 = (data: Uint8Array) => createHash('sha256').update(data).digest('hex');

/** Where a key's copy lives under DIR/objects; a key that would leave that folder is refused. */
function fileOf(dir: string, key: string): string {
  if (key.startsWith('/') || key.split('/').some((part) => part === '..' || part === '.' || part === '')) {
    throw new Error(`An object key that is not a plain path, not copied: ${JSON.stringify(key)}`);
  }
  return path.join(dir, 'objects', ...key.split('/'));
}

async function* keys(client: S3Client, bucket: string): AsyncGenerator<string> {
  let token: string | undefined;
  do {
    const page = await client.send(new ListObjectsV2Command({ Bucket: bucket, ContinuationToken: token }));
    for (const o of page.Contents ?? []) if (o.Key && !o.Key.startsWith(SKIPPED_PREFIX)) yield o.Key;
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
}

async function backup(client: S3Client, bucket: string, dir: string): Promise<void> {
  if (fs.existsSync(dir)) throw new Error(`${dir} exists already; give a new folder.`);
  const partial = `${dir}.partial`;
  fs.rmSync(partial, { recursive: true, force: true });
  const objects: Entry[] = [];
  for await (const key of keys(client, bucket)) {
    const out = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
    const data = await out.Body!.transformToByteArray();
    const file = fileOf(partial, key);
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, data);
    objects.push({
      key,
      bytes: data.byteLength,
      sha256: sha256(data),
      contentType: out.ContentType ?? 'application/octet-stream',
    });
  }
  const manifest: Manifest = { bucket, madeAt: new Date().toISOString(), objects };
  fs.mkdirSync(partial, { recursive: true });
  fs.writeFileSync(path.join(partial, 'manifest.json'), `${JSON.stringify(manifest, null, 2)}\n`);
  fs.renameSync(partial, dir);
  const total = objects.reduce((n, o) => n + o.bytes, 0);
  console.log(`Backed up ${objects.length} files (${(total / 1024).toFixed(0)} KiB) of bucket ${bucket} to ${dir}`);
}

async function restore(client: S3Client, bucket: string, dir: string): Promise<void> {
  const manifestFile = path.join(dir, 'manifest.json');
  if (!fs.existsSync(manifestFile)) throw new Error(`No manifest.json in ${dir}: not a file backup.`);
  const manifest = JSON.parse(fs.readFileSync(manifestFile, 'utf8')) as Manifest;
  // Every copy checked before anything is put; each is read again to put it, so that only one
  // file at a time is held in memory however large the bucket
  const read = (o: Entry) => new Uint8Array(fs.readFileSync(fileOf(dir, o.key)));
  for (const o of manifest.objects) {
    if (!fs.existsSync(fileOf(dir, o.key))) throw new Error(`Missing from the backup: ${o.key}. Nothing was restored.`);
    const data = read(o);
    if (data.byteLength !== o.bytes || sha256(data) !== o.sha256) {
      throw new Error(`Changed since the backup (its SHA-256 differs): ${o.key}. Nothing was restored.`);
    }
  }
  for (const o of manifest.objects) {
    await client.send(
      new PutObjectCommand({
        Bucket: bucket,
        Key: o.key,
        Body: read(o),
        ContentType: o.contentType,
        ContentLength: o.bytes,
      }),
    );
  }
  console.log(`Restored ${manifest.objects.length} files into bucket ${bucket} from ${dir}`);
}

async function main() {
  const [command, dir] = process.argv.slice(2);
  if (!['backup', 'restore'].includes(command ?? '') || !dir) {
    console.error('usage: scripts/files.ts backup DIR | restore DIR');
    process.exit(2);
  }
  const e = env();
  const client = new S3Client(s3Config(e));
  await (command === 'backup' ? backup : restore)(client, e.S3_BUCKET, path.resolve(dir));
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
