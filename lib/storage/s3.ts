import 'server-only';

import { DeleteObjectCommand, GetObjectCommand, NoSuchKey, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';

import { env } from '@/lib/env';
import { HttpError, SOCKET_AWAY_CODES } from '@/lib/errors';

import { s3Config } from './s3-config';

let client: S3Client | undefined;

/** The S3 client (one per server bundle, made on first use; settings in s3-config.ts). */
export function s3(): S3Client {
  client ??= new S3Client(s3Config(env()));
  return client;
}

/** Object storage that did not answer, or failed on its side: 503 saying so, to try again later. */
export class StorageUnavailable extends HttpError {
  constructor() {
    super(503, 'File storage is not reachable just now. Nothing was changed; try again shortly.', { retryAfter: 5 });
  }
}

// Socket errors of a storage that is away (no answer came back at all)
const AWAY_CODES = new Set<string>(SOCKET_AWAY_CODES);

/**
 * Whether an S3 SDK error means the storage is away or failing (no answer, a timeout, or a 5xx
 * from it after the SDK's own retries), rather than a refusal of this request.
 */
export function storageAway(err: unknown): boolean {
  if (!err || typeof err !== 'object') return false;
  const e = err as { code?: string; name?: string; $metadata?: { httpStatusCode?: number } };
  const status = e.$metadata?.httpStatusCode;
  if (status !== undefined) return status >= 500;
  return (e.code !== undefined && AWAY_CODES.has(e.code)) || e.name === 'TimeoutError';
}

/** Runs a storage call; a storage that is away becomes `StorageUnavailable`. */
async function guarded<T>(call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (err) {
    throw storageAway(err) ? new StorageUnavailable() : err;
  }
}

/** Stores bytes under a key in the app's bucket. */
export async function putObject(key: string, body: Uint8Array, contentType: string): Promise<void> {
  await guarded(() =>
    s3().send(
      new PutObjectCommand({
        Bucket: env().S3_BUCKET,
        Key: key,
        Body: body,
        ContentType: contentType,
        ContentLength: body.byteLength,
      }),
    ),
  );
}

/** An object as a web stream with its length, or null when the key does not exist. */
export async function getObjectStream(
  key: string,
): Promise<{ body: ReadableStream<Uint8Array>; length: number | undefined } | null> {
  try {
    const out = await guarded(() => s3().send(new GetObjectCommand({ Bucket: env().S3_BUCKET, Key: key })));
    if (!out.Body) return null;
    return {
      body: out.Body.transformToWebStream() as ReadableStream<Uint8Array>,
      length: out.ContentLength,
    };
  } catch (err) {
    if (err instanceof NoSuchKey || (err as { name?: string }).name === 'NoSuchKey') return null;
    throw err;
  }
}

/** An object's bytes, or null when the key does not exist. */
export async function getObjectBytes(key: string): Promise<Uint8Array | null> {
  const found = await getObjectStream(key);
  if (!found) return null;
  return new Uint8Array(await new Response(found.body).arrayBuffer());
}

/** Removes objects; keys that do not exist are ignored. */
export async function deleteObjects(keys: string[]): Promise<void> {
  // One call per key: the batch call needs a body checksum that not every S3 fake accepts.
  await Promise.all(
    keys.map((Key) => guarded(() => s3().send(new DeleteObjectCommand({ Bucket: env().S3_BUCKET, Key })))),
  );
}
