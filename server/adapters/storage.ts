import { DeleteObjectCommand, GetObjectCommand, HeadBucketCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import type { Config } from '../config';

/** Object storage as the app uses it; S3 in production, s3rver locally, through the same client. */
export interface Storage {
  readonly bucket: string;
  readonly client: S3Client;
  ping(): Promise<void>;
  put(key: string, body: Buffer | Uint8Array, contentType: string): Promise<void>;
  get(key: string): Promise<Buffer>;
  remove(key: string): Promise<void>;
  close(): void;
}

const PING_TIMEOUT_MS = 3_000;

/** Builds the S3 client from config; a custom endpoint (s3rver, MinIO) uses path-style URLs. */
export function createS3Storage(
  config: Pick<Config, 'S3_ENDPOINT' | 'S3_REGION' | 'S3_BUCKET' | 'S3_ACCESS_KEY_ID' | 'S3_SECRET_ACCESS_KEY' | 's3ForcePathStyle'>,
): Storage {
  const client = new S3Client({
    region: config.S3_REGION,
    ...(config.S3_ENDPOINT ? { endpoint: config.S3_ENDPOINT } : {}),
    forcePathStyle: config.s3ForcePathStyle,
    credentials: { accessKeyId: config.S3_ACCESS_KEY_ID, secretAccessKey: config.S3_SECRET_ACCESS_KEY },
    // s3rver stores aws-chunked framing verbatim unless checksums are only sent when required.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    maxAttempts: 2,
    requestHandler: { connectionTimeout: 3_000, requestTimeout: 30_000 },
  });
  const bucket = config.S3_BUCKET;
  return {
    bucket,
    client,
    async ping() {
      await client.send(new HeadBucketCommand({ Bucket: bucket }), { abortSignal: AbortSignal.timeout(PING_TIMEOUT_MS) });
    },
    async put(key, body, contentType) {
      await client.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: body, ContentType: contentType }));
    },
    async get(key) {
      const out = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
      if (!out.Body) throw new Error(`Empty body for ${key}`);
      return Buffer.from(await out.Body.transformToByteArray());
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
    },
    close: () => client.destroy(),
  };
}
