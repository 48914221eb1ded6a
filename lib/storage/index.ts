import 'server-only';
import {
  DeleteObjectCommand,
  GetObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import { env } from '@/lib/env';

/**
 * The photo store: an S3 bucket reached through the AWS SDK. Locally and in tests the endpoint is
 * our S3 fake (scripts/s3-fake.ts); in production S3_ENDPOINT names the real service.
 */
const globalForStorage = globalThis as unknown as { kfS3?: S3Client };

function client(): S3Client {
  if (!globalForStorage.kfS3) {
    const e = env();
    globalForStorage.kfS3 = new S3Client({
      endpoint: e.S3_ENDPOINT,
      region: e.S3_REGION,
      forcePathStyle: true,
      credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
    });
  }
  return globalForStorage.kfS3;
}

export async function putObject(key: string, body: Buffer, contentType: string): Promise<void> {
  await client().send(
    new PutObjectCommand({
      Bucket: env().S3_BUCKET,
      Key: key,
      Body: body,
      ContentType: contentType,
      ContentLength: body.length,
    }),
  );
}

/** The object's bytes, or null when there is no such key. */
export async function getObject(key: string): Promise<Buffer | null> {
  try {
    const res = await client().send(new GetObjectCommand({ Bucket: env().S3_BUCKET, Key: key }));
    if (!res.Body) return null;
    return Buffer.from(await res.Body.transformToByteArray());
  } catch (err) {
    if ((err as { name?: string }).name === 'NoSuchKey') return null;
    throw err;
  }
}

/** Deletes each key (deleting a missing key is not an error in S3). */
export async function deleteObjects(keys: string[]): Promise<void> {
  await Promise.all(keys.map((Key) => client().send(new DeleteObjectCommand({ Bucket: env().S3_BUCKET, Key }))));
}

/** Every key in the bucket (all pages of the listing), for backups. */
export async function listObjectKeys(prefix = ''): Promise<string[]> {
  const keys: string[] = [];
  let token: string | undefined;
  do {
    const page = await client().send(
      new ListObjectsV2Command({ Bucket: env().S3_BUCKET, Prefix: prefix || undefined, ContinuationToken: token }),
    );
    for (const item of page.Contents ?? []) if (item.Key) keys.push(item.Key);
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  return keys;
}
