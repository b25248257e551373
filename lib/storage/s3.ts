import 'server-only';
import { CreateBucketCommand, GetObjectCommand, HeadBucketCommand, HeadObjectCommand, PutObjectCommand, S3Client, NotFound } from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import type { Readable } from 'node:stream';
import { env } from '@/lib/env';

// One client for the object store. Locally it points at the S3 fake that
// `npm start` runs; S3_ENDPOINT/REGION/BUCKET/keys point it at any
// S3-compatible store. Checksums are computed only when required: the local
// fake stores streamed uploads with their chunk framing otherwise (stack.md).
let client: S3Client | undefined;
export function s3(): S3Client {
  client ??= new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  return client;
}

export const bucket = () => env.S3_BUCKET;

/** Creates the bucket when it does not exist yet. */
export async function ensureBucket(): Promise<void> {
  try {
    await s3().send(new HeadBucketCommand({ Bucket: bucket() }));
  } catch {
    await s3().send(new CreateBucketCommand({ Bucket: bucket() }));
  }
}

/** The stored object's SHA-256 (our metadata) and size, or null when absent. */
export async function headObject(key: string): Promise<{ sha256: string | null; size: number } | null> {
  try {
    const head = await s3().send(new HeadObjectCommand({ Bucket: bucket(), Key: key }));
    return { sha256: head.Metadata?.sha256 ?? null, size: head.ContentLength ?? 0 };
  } catch (error) {
    if (error instanceof NotFound || (error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return null;
    throw error;
  }
}

/**
 * Stores bytes under a deterministic key, never overwriting different bytes:
 * an identical object is left alone ('exists'); a different one is an error.
 */
export async function putImmutable(key: string, body: Uint8Array, sha256: string, contentType: string): Promise<'stored' | 'exists'> {
  const existing = await headObject(key);
  if (existing) {
    if (existing.sha256 === sha256) return 'exists';
    throw new Error(`object ${key} already holds different bytes (sha256 ${existing.sha256}); refusing to overwrite`);
  }
  await s3().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: body, ContentType: contentType, Metadata: { sha256 } }));
  return 'stored';
}

export async function getObjectStream(key: string): Promise<Readable> {
  const object = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
  return object.Body as Readable;
}

export async function getObjectBytes(key: string): Promise<Uint8Array> {
  const object = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
  return object.Body!.transformToByteArray();
}

/** A time-limited download link (the caller has already checked the person's role). */
export async function presignedDownload(key: string, fileName: string): Promise<string> {
  return getSignedUrl(s3(), new GetObjectCommand({ Bucket: bucket(), Key: key, ResponseContentDisposition: `attachment; filename="${fileName}"` }), { expiresIn: env.S3_PRESIGN_SECONDS });
}
