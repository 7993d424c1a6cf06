// S3-compatible storage through the AWS SDK, configured only by the environment, so the local fake
// (s3rver, started by our scripts) and a real service are used the same way.
import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { config } from "@/lib/config";

let client: S3Client | undefined;

export function s3(): S3Client {
  const { endpoint, region, forcePathStyle, accessKeyId, secretAccessKey } = config().s3;
  client ??= new S3Client({ endpoint, region, forcePathStyle, credentials: { accessKeyId, secretAccessKey } });
  return client;
}

export const bucket = () => config().s3.bucket;

/** A short-lived URL the device PUTs the bytes to; the Content-Type must match what was signed. */
export const presignPut = (key: string, contentType: string, sizeBytes: number) =>
  getSignedUrl(s3(), new PutObjectCommand({ Bucket: bucket(), Key: key, ContentType: contentType, ContentLength: sizeBytes }), { expiresIn: 15 * 60 });

export const presignGet = (key: string) => getSignedUrl(s3(), new GetObjectCommand({ Bucket: bucket(), Key: key }), { expiresIn: 5 * 60 });

export async function headObject(key: string): Promise<{ size: number; contentType: string } | null> {
  try {
    const head = await s3().send(new HeadObjectCommand({ Bucket: bucket(), Key: key }));
    return { size: head.ContentLength ?? -1, contentType: head.ContentType ?? "" };
  } catch (error) {
    if ((error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return null;
    throw error;
  }
}

export async function readObject(key: string): Promise<Buffer> {
  const res = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
  return Buffer.from(await res.Body!.transformToByteArray());
}

/** Writes bytes the server has checked (the device never writes through this). */
export async function writeObject(key: string, bytes: Buffer, contentType: string): Promise<void> {
  await s3().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: bytes, ContentType: contentType }));
}

export async function deleteObject(key: string): Promise<void> {
  await s3().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }));
}
