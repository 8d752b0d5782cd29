import 'server-only';
import { randomBytes } from 'node:crypto';
import { GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { fileTypeFromBuffer } from 'file-type/core';
import { env } from '@/lib/env';

/** Largest photo accepted, in bytes (10 MB). */
export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;

/** Image types a photo may have, by what the bytes say (never by the name or the browser's word). */
export const PHOTO_TYPES: Record<string, string> = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'image/webp': 'webp',
  'image/gif': 'gif',
  'image/avif': 'avif',
  'image/heic': 'heic',
  'image/heif': 'heif',
};

const globalForS3 = globalThis as unknown as { __brixhouseS3?: S3Client };

/** One S3 client per process; endpoint, bucket, region, keys and path-style from the environment. */
export function s3(): S3Client {
  if (!globalForS3.__brixhouseS3) {
    const e = env();
    globalForS3.__brixhouseS3 = new S3Client({
      endpoint: e.S3_ENDPOINT,
      region: e.S3_REGION,
      forcePathStyle: e.S3_FORCE_PATH_STYLE,
      credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
    });
  }
  return globalForS3.__brixhouseS3;
}

export class PhotoRejected extends Error {
  constructor(
    public readonly reason: 'too-large' | 'not-an-image' | 'empty',
    message: string,
  ) {
    super(message);
    this.name = 'PhotoRejected';
  }
}

/** The image type the bytes carry, or null. */
export async function sniffImage(bytes: Uint8Array): Promise<{ mime: string; ext: string } | null> {
  const found = await fileTypeFromBuffer(bytes);
  if (!found || !PHOTO_TYPES[found.mime]) return null;
  return { mime: found.mime, ext: PHOTO_TYPES[found.mime] };
}

/** A key nobody can guess, under the co-op's own prefix: `<coop>/photos/<yyyy-mm>/<random>.<ext>`. */
export function newPhotoKey(cooperativeId: string, ext: string, now = new Date()): string {
  const month = now.toISOString().slice(0, 7);
  return `${cooperativeId}/photos/${month}/${randomBytes(24).toString('base64url')}.${ext}`;
}

/** Checks and stores a photo; returns its key. */
export async function storePhoto({ cooperativeId, bytes }: { cooperativeId: string; bytes: Uint8Array }): Promise<string> {
  if (bytes.byteLength === 0) throw new PhotoRejected('empty', 'The photo is empty.');
  if (bytes.byteLength > MAX_PHOTO_BYTES) throw new PhotoRejected('too-large', 'The photo is larger than 10 MB.');
  const type = await sniffImage(bytes);
  if (!type) throw new PhotoRejected('not-an-image', 'Only photos (JPEG, PNG, WebP, GIF, AVIF or HEIC) can be attached.');
  const key = newPhotoKey(cooperativeId, type.ext);
  await s3().send(
    new PutObjectCommand({ Bucket: env().S3_BUCKET, Key: key, Body: bytes, ContentType: type.mime, ContentLength: bytes.byteLength }),
  );
  return key;
}

/** True when `key` belongs to the co-op (by its prefix); keys are never trusted otherwise. */
export const isCoopKey = (cooperativeId: string, key: string) =>
  key.startsWith(`${cooperativeId}/photos/`) && !key.includes('..') && /^[A-Za-z0-9/_.-]+$/.test(key);

/** Whether an object exists under `key`. */
export async function photoExists(key: string): Promise<boolean> {
  try {
    await s3().send(new HeadObjectCommand({ Bucket: env().S3_BUCKET, Key: key }));
    return true;
  } catch (err) {
    if (isNotFound(err)) return false;
    throw err;
  }
}

/** The stored photo's bytes and type, or null when there is none. */
export async function readPhoto(key: string): Promise<{ body: Uint8Array; contentType: string } | null> {
  try {
    const out = await s3().send(new GetObjectCommand({ Bucket: env().S3_BUCKET, Key: key }));
    const body = await out.Body!.transformToByteArray();
    return { body, contentType: out.ContentType ?? 'application/octet-stream' };
  } catch (err) {
    if (isNotFound(err)) return null;
    throw err;
  }
}

function isNotFound(err: unknown): boolean {
  const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e?.name === 'NoSuchKey' || e?.name === 'NotFound' || e?.$metadata?.httpStatusCode === 404;
}
