import { GetObjectCommand, S3Client } from '@aws-sdk/client-s3';

/** The error the S3 SDK itself gives when nothing listens at the endpoint (port 9 on loopback). */
export async function noAnswer(): Promise<unknown> {
  const dead = new S3Client({
    region: 'local',
    endpoint: 'http://127.0.0.1:9',
    forcePathStyle: true,
    credentials: { accessKeyId: 'x', secretAccessKey: 'x' },
    maxAttempts: 1,
  });
  return dead.send(new GetObjectCommand({ Bucket: 'b', Key: 'k' })).then(
    () => new Error('something answered on port 9'),
    (err: unknown) => err,
  );
}
