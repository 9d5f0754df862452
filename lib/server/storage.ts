import 'server-only';
import { createReadStream } from 'node:fs';
import { stat } from 'node:fs/promises';
import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { getEnv } from './env';

const holder = globalThis as unknown as { __epicycleS3?: S3Client };

/**
 * The object store (S3 API). Path-style addressing and checksums only when required: with the SDK's defaults,
 * streamed uploads to the local fake store get chunk framing written into the object itself.
 */
export function s3(): S3Client {
  if (!holder.__epicycleS3) {
    const env = getEnv();
    holder.__epicycleS3 = new S3Client({
      region: env.S3_REGION,
      ...(env.S3_ENDPOINT ? { endpoint: env.S3_ENDPOINT } : {}),
      forcePathStyle: true,
      credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
    });
  }
  return holder.__epicycleS3;
}

const bucket = () => getEnv().S3_BUCKET;

/** Uploads a finished file in one PUT, so the object appears whole or not at all. */
export async function putFile(key: string, path: string, contentType: string, metadata: Record<string, string> = {}): Promise<number> {
  const { size } = await stat(path);
  await s3().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: createReadStream(path), ContentLength: size, ContentType: contentType, Metadata: metadata }));
  return size;
}

export async function deleteObject(key: string): Promise<void> {
  await s3().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }));
}

/** The object's size, or null when it does not exist. */
export async function objectSize(key: string): Promise<number | null> {
  try {
    const head = await s3().send(new HeadObjectCommand({ Bucket: bucket(), Key: key }));
    return head.ContentLength ?? null;
  } catch (error) {
    if ((error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404 || (error as { name?: string }).name === 'NotFound') return null;
    throw error;
  }
}

/** Every object under `prefix` with its size (all pages), for checks that nothing stray was left behind. */
export async function listObjects(prefix: string): Promise<{ key: string; size: number }[]> {
  const out: { key: string; size: number }[] = [];
  let token: string | undefined;
  do {
    const page = await s3().send(new ListObjectsV2Command({ Bucket: bucket(), Prefix: prefix, ContinuationToken: token }));
    for (const o of page.Contents ?? []) out.push({ key: o.Key!, size: o.Size ?? 0 });
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  return out;
}

/** The whole object, for tests and checks of small objects. */
export async function readObject(key: string): Promise<Uint8Array> {
  const r = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
  return r.Body!.transformToByteArray();
}

/** A short-lived presigned GET for one object, named for download. */
export function presignDownload(key: string, filename: string): Promise<string> {
  return getSignedUrl(s3(), new GetObjectCommand({ Bucket: bucket(), Key: key, ResponseContentDisposition: `attachment; filename="${filename}"` }), {
    expiresIn: getEnv().PRESIGNED_URL_SECONDS,
  });
}
