import 'server-only';
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { getEnv } from '@/lib/env';

const globalForS3 = globalThis as unknown as { rigcallS3?: S3Client };

function client(): S3Client {
  if (!globalForS3.rigcallS3) {
    const env = getEnv();
    globalForS3.rigcallS3 = new S3Client({
      region: env.S3_REGION,
      endpoint: env.S3_ENDPOINT,
      forcePathStyle: env.S3_FORCE_PATH_STYLE,
      credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
    });
  }
  return globalForS3.rigcallS3;
}

export async function putObject(key: string, body: Uint8Array, contentType: string): Promise<void> {
  await client().send(
    new PutObjectCommand({ Bucket: getEnv().S3_BUCKET, Key: key, Body: body, ContentType: contentType }),
  );
}

/** Remove an object (nothing happens when it is not there). */
export async function deleteObject(key: string): Promise<void> {
  await client().send(new DeleteObjectCommand({ Bucket: getEnv().S3_BUCKET, Key: key }));
}

/**
 * Objects that belong to a row being written: put them while the row's transaction is open, and
 * discard them when the transaction fails, so that no object is left without its row.
 */
export function startObjectBatch() {
  const stored: string[] = [];
  return {
    async put(key: string, body: Uint8Array, contentType: string): Promise<void> {
      await putObject(key, body, contentType);
      stored.push(key);
    },
    async discard(): Promise<void> {
      await Promise.allSettled(stored.map((k) => deleteObject(k)));
    },
  };
}

export async function getObjectBytes(key: string): Promise<{ bytes: Uint8Array; contentType: string | undefined }> {
  const out = await client().send(new GetObjectCommand({ Bucket: getEnv().S3_BUCKET, Key: key }));
  if (!out.Body) throw new Error(`object ${key} has no body`);
  return { bytes: await out.Body.transformToByteArray(), contentType: out.ContentType };
}

/** A URL the browser may PUT one object to, for a few minutes. */
export async function presignPut(key: string, contentType: string, expiresIn = 300): Promise<string> {
  return getSignedUrl(
    client(),
    new PutObjectCommand({ Bucket: getEnv().S3_BUCKET, Key: key, ContentType: contentType }),
    { expiresIn },
  );
}

export async function presignGet(key: string, expiresIn = 300): Promise<string> {
  return getSignedUrl(client(), new GetObjectCommand({ Bucket: getEnv().S3_BUCKET, Key: key }), { expiresIn });
}

/** True when the object store answers and the bucket exists. */
export async function checkStorage(): Promise<boolean> {
  try {
    await client().send(new HeadBucketCommand({ Bucket: getEnv().S3_BUCKET }));
    return true;
  } catch {
    return false;
  }
}
