/**
 * Photos live in S3-compatible object storage, never on the app's disk. Settings come from the
 * environment and are parsed with zod once at start (the middleware asks on load), so a half-set
 * configuration stops the app with the variable named. Locally `npm start` and `npm test` point
 * these at the project's own s3rver.
 */
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { z } from 'zod';

const schema = z.object({
  BONDMAP_S3_ENDPOINT: z.string().url('must be a URL such as https://objects.example.test'),
  BONDMAP_S3_BUCKET: z.string().regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, 'must be an S3 bucket name (3–63 lower-case letters, digits, dots, hyphens)'),
  BONDMAP_S3_ACCESS_KEY_ID: z.string().min(1, 'is required'),
  BONDMAP_S3_SECRET_ACCESS_KEY: z.string().min(1, 'is required'),
  BONDMAP_S3_REGION: z.string().min(1).default('us-east-1'),
});
export type ObjectStoreSettings = z.infer<typeof schema>;

let cached: ObjectStoreSettings | null | undefined;

/** The store's settings, or null when none is configured (photos then answer 503). */
export function objectStoreSettings(env: NodeJS.ProcessEnv = process.env): ObjectStoreSettings | null {
  if (cached !== undefined && env === process.env) return cached;
  const given = Object.keys(env).some((k) => k.startsWith('BONDMAP_S3_') && env[k]);
  let result: ObjectStoreSettings | null = null;
  if (given) {
    const parsed = schema.safeParse(env);
    if (!parsed.success) throw new Error(`Bad object store settings: ${parsed.error.issues.map((i) => `${i.path.join('.')} ${i.message}`).join('; ')}`);
    result = parsed.data;
  }
  if (env === process.env) cached = result;
  return result;
}

let client: S3Client | null = null;
function s3(): { client: S3Client; bucket: string } | null {
  const config = objectStoreSettings();
  if (!config) return null;
  client ??= new S3Client({
    endpoint: config.BONDMAP_S3_ENDPOINT,
    region: config.BONDMAP_S3_REGION,
    forcePathStyle: true,
    credentials: { accessKeyId: config.BONDMAP_S3_ACCESS_KEY_ID, secretAccessKey: config.BONDMAP_S3_SECRET_ACCESS_KEY },
    // Checksums only where S3 requires them: S3-compatible stores differ in what they accept.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    maxAttempts: 2,
  });
  return { client, bucket: config.BONDMAP_S3_BUCKET };
}

export class ObjectStoreUnavailable extends Error {}

function store() {
  const s = s3();
  if (!s) throw new ObjectStoreUnavailable('no object store is configured (BONDMAP_S3_ENDPOINT)');
  return s;
}

export async function putObject(key: string, body: Buffer, contentType: string): Promise<void> {
  const { client: c, bucket } = store();
  await c.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.length }));
}

/** The object as a web stream with its type and length, or null when it is not there. */
export async function getObject(key: string): Promise<{ body: ReadableStream; contentType: string; length: number | undefined } | null> {
  const { client: c, bucket } = store();
  try {
    const out = await c.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
    if (!out.Body) return null;
    return { body: out.Body.transformToWebStream(), contentType: out.ContentType ?? 'application/octet-stream', length: out.ContentLength };
  } catch (error) {
    if ((error as { name?: string }).name === 'NoSuchKey') return null;
    throw error;
  }
}

export async function deleteObjects(keys: string[]): Promise<void> {
  if (!keys.length) return;
  const { client: c, bucket } = store();
  // One by one: the batch call needs a checksum header not every S3-compatible store accepts.
  await Promise.all(keys.map((Key) => c.send(new DeleteObjectCommand({ Bucket: bucket, Key }))));
}
