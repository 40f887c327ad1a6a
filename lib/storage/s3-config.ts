import type { S3ClientConfig } from '@aws-sdk/client-s3';

import type { Env } from '@/lib/env';

/**
 * The S3 client's settings from the environment: the app's client (lib/storage/s3.ts) and the
 * file backup (scripts/files.ts) alike. Path-style addressing and checksums only when required:
 * the local S3 fake stores the SDK's streaming checksum frames inside the object otherwise (a 2 MB
 * upload came back 55 bytes longer, its framing and a checksum line stored inside it).
 */
export function s3Config(e: Env): S3ClientConfig {
  return {
    region: e.S3_REGION,
    endpoint: e.S3_ENDPOINT,
    forcePathStyle: true,
    credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    // A storage that hangs fails the call instead of holding it for good
    requestHandler: { connectionTimeout: 3_000, requestTimeout: 30_000, throwOnRequestTimeout: true },
  };
}
