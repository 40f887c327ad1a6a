import { S3ServiceException } from '@aws-sdk/client-s3';
import { describe, expect, it } from 'vitest';

import { storageAway } from '@/lib/storage/s3';

import { noAnswer } from '../../stubs/storage-away';

/** A service error as the SDK builds it from an HTTP answer with this status. */
const answered = (name: string, status: number) =>
  new S3ServiceException({ name, $fault: status >= 500 ? 'server' : 'client', $metadata: { httpStatusCode: status } });

describe('storageAway: a storage that is away, not a refusal of the request', () => {
  it('is true when nothing answers (the SDK’s own error, ECONNREFUSED)', async () => {
    const err = await noAnswer();
    expect((err as { code?: string }).code).toBe('ECONNREFUSED');
    expect(storageAway(err)).toBe(true);
  });

  it('is true for a 5xx from the storage and for a timeout', () => {
    expect(storageAway(answered('ServiceUnavailable', 503))).toBe(true);
    expect(storageAway(answered('InternalError', 500))).toBe(true);
    expect(storageAway(Object.assign(new Error('timed out'), { name: 'TimeoutError' }))).toBe(true);
  });

  it('is false for the storage refusing the request, and for anything else', () => {
    expect(storageAway(answered('NoSuchKey', 404))).toBe(false);
    expect(storageAway(answered('AccessDenied', 403))).toBe(false);
    expect(storageAway(new Error('a bug'))).toBe(false);
    expect(storageAway(null)).toBe(false);
  });
});
