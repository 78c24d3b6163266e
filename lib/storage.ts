// Object storage (photos, drawings, permit PDFs) through the AWS SDK: the S3 fake locally,
// S3 or any S3-compatible store in production, chosen by environment only.
import "server-only";
import {
  DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { env } from "@/lib/env";
import { AppError, NETWORK_ERROR_CODES } from "@/lib/errors";

/** The store cannot be reached (down, refused, timed out): a 503 with a sentence, never a stack trace. */
export class StorageUnavailableError extends AppError {
  constructor(cause?: unknown) {
    super(503, "store_unavailable", "The file store cannot be reached just now; nothing was lost. Try again in a minute.", undefined, cause);
  }
}

/** A network failure carries no HTTP status from the store; an answer from the store (404, 403…) does. */
function isUnreachable(e: unknown): boolean {
  const status = (e as { $metadata?: { httpStatusCode?: number } })?.$metadata?.httpStatusCode;
  if (typeof status === "number") return status >= 500;
  const code = (e as { code?: string })?.code ?? (e as { cause?: { code?: string } })?.cause?.code;
  const name = (e as Error)?.name;
  return (
    NETWORK_ERROR_CODES.has(code ?? "") ||
    ["TimeoutError", "RequestTimeout", "NetworkingError"].includes(name ?? "") ||
    (e as Error)?.constructor?.name === "AggregateError"
  );
}

async function send<T>(fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (e) {
    if (isUnreachable(e)) throw new StorageUnavailableError(e);
    throw e;
  }
}

function client(endpoint: string | undefined) {
  return new S3Client({
    region: env.S3_REGION,
    endpoint,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
    // Stricter S3-compatible servers reject the empty-body checksum a presigned PUT would carry.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
}

const s3 = client(env.S3_ENDPOINT);
const publicS3 = env.S3_PUBLIC_ENDPOINT ? client(env.S3_PUBLIC_ENDPOINT) : s3;
const Bucket = env.S3_BUCKET;

export async function putObject(key: string, body: Uint8Array | Buffer | string, contentType: string) {
  await send(() => s3.send(new PutObjectCommand({ Bucket, Key: key, Body: body, ContentType: contentType })));
}

export async function getObject(key: string): Promise<Buffer> {
  const bytes = await send(async () => {
    const r = await s3.send(new GetObjectCommand({ Bucket, Key: key }));
    return r.Body!.transformToByteArray();
  });
  return Buffer.from(bytes);
}

/** Size and type of a stored object, or null when it does not exist. */
export async function headObject(key: string): Promise<{ size: number; contentType?: string } | null> {
  try {
    const r = await s3.send(new HeadObjectCommand({ Bucket, Key: key }));
    return { size: r.ContentLength ?? 0, contentType: r.ContentType };
  } catch (e) {
    const status = (e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
    if (status === 404 || (e as Error).name === "NotFound" || (e as Error).name === "NoSuchKey") return null;
    if (isUnreachable(e)) throw new StorageUnavailableError(e);
    throw e;
  }
}

export async function deleteObject(key: string) {
  await send(() => s3.send(new DeleteObjectCommand({ Bucket, Key: key })));
}

/** A URL the browser can PUT the bytes to directly, so the app server never carries them. */
export function presignPut(key: string, contentType: string, expiresIn = 15 * 60) {
  return getSignedUrl(publicS3, new PutObjectCommand({ Bucket, Key: key, ContentType: contentType }), { expiresIn });
}

export function presignGet(key: string, expiresIn = 60 * 60, filename?: string) {
  return getSignedUrl(
    publicS3,
    new GetObjectCommand({
      Bucket,
      Key: key,
      ...(filename ? { ResponseContentDisposition: `inline; filename="${filename.replace(/"/g, "")}"` } : {}),
    }),
    { expiresIn },
  );
}
