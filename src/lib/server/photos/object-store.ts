// Object storage through the AWS S3 SDK: a real bucket in production, the local fake our scripts
// start otherwise (scripts/lib/fakes/s3.mjs). Path-style addressing, as most S3-compatible
// stores expect.
import { GetObjectCommand, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3';

export type ObjectStoreConfig = {
  endpoint: string | undefined;
  region: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  forcePathStyle: boolean;
};

export function objectStoreConfig(env: NodeJS.ProcessEnv = process.env): ObjectStoreConfig {
  const bucket = env.S3_BUCKET;
  const accessKeyId = env.S3_ACCESS_KEY_ID;
  const secretAccessKey = env.S3_SECRET_ACCESS_KEY;
  if (!bucket || !accessKeyId || !secretAccessKey) {
    throw new Error('S3_BUCKET, S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY must be set (npm start sets up a local store).');
  }
  return {
    endpoint: env.S3_ENDPOINT || undefined,
    region: env.S3_REGION ?? 'us-east-1',
    bucket,
    accessKeyId,
    secretAccessKey,
    forcePathStyle: env.S3_FORCE_PATH_STYLE !== '0',
  };
}

let client: { s3: S3Client; bucket: string } | undefined;

function store() {
  if (!client) {
    const config = objectStoreConfig();
    client = {
      bucket: config.bucket,
      s3: new S3Client({
        endpoint: config.endpoint,
        region: config.region,
        forcePathStyle: config.forcePathStyle,
        credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey },
      }),
    };
  }
  return client;
}

export async function putObject(key: string, body: Uint8Array, contentType: string): Promise<void> {
  const { s3, bucket } = store();
  await s3.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: body, ContentType: contentType }));
}

/** The object's bytes, or null when the store has no such key. */
export async function getObject(key: string): Promise<{ bytes: Uint8Array; contentType: string } | null> {
  const { s3, bucket } = store();
  try {
    const result = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
    if (!result.Body) return null;
    return { bytes: await result.Body.transformToByteArray(), contentType: result.ContentType ?? 'application/octet-stream' };
  } catch (error) {
    if (error instanceof S3ServiceException && error.$metadata.httpStatusCode === 404) return null;
    throw error;
  }
}
