import "server-only";
import { DeleteObjectCommand, GetObjectCommand, NoSuchKey, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { serverEnv } from "./env";

// The one adapter to object storage (the local S3 fake, or any S3-compatible store beyond one machine).
// Keys are always ours (e.g. certificates/<uuid>), never derived from what a user uploaded.

const globalForStorage = globalThis as unknown as { threadlineS3?: S3Client };

function s3(): S3Client {
  const env = serverEnv();
  globalForStorage.threadlineS3 ??= new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
    forcePathStyle: true,
    // Without both, the SDK frames uploads as aws-chunked with trailing checksums, which the
    // fake stores as part of the object: the bytes read back would differ from those sent.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  return globalForStorage.threadlineS3;
}

export async function putObject(key: string, body: Uint8Array, contentType: string, metadata: Record<string, string> = {}): Promise<void> {
  await s3().send(
    new PutObjectCommand({
      Bucket: serverEnv().S3_BUCKET,
      Key: key,
      Body: body,
      ContentType: contentType,
      ContentLength: body.byteLength,
      Metadata: metadata,
    }),
  );
}

/** The object's bytes as a web stream, or null when there is no such object. */
export async function getObjectStream(key: string): Promise<{ stream: ReadableStream<Uint8Array>; size: number | null } | null> {
  try {
    const response = await s3().send(new GetObjectCommand({ Bucket: serverEnv().S3_BUCKET, Key: key }));
    if (!response.Body) return null;
    return { stream: response.Body.transformToWebStream() as ReadableStream<Uint8Array>, size: response.ContentLength ?? null };
  } catch (error) {
    if (error instanceof NoSuchKey || (error as { name?: string }).name === "NoSuchKey") return null;
    throw error;
  }
}

export async function deleteObject(key: string): Promise<void> {
  await s3().send(new DeleteObjectCommand({ Bucket: serverEnv().S3_BUCKET, Key: key }));
}
