/** Photo uploads over HTTP and a look into the local object store (s3rver), for the photo tests. */
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import sharp from 'sharp';
import { BASE_URL, type Client } from './api';

const s3 = new S3Client({
  endpoint: process.env.BONDMAP_S3_ENDPOINT,
  region: 'us-east-1',
  forcePathStyle: true,
  credentials: { accessKeyId: process.env.BONDMAP_S3_ACCESS_KEY_ID ?? '', secretAccessKey: process.env.BONDMAP_S3_SECRET_ACCESS_KEY ?? '' },
  requestChecksumCalculation: 'WHEN_REQUIRED',
  responseChecksumValidation: 'WHEN_REQUIRED',
});
const bucket = process.env.BONDMAP_S3_BUCKET ?? '';

export async function storedKeys(recordId: number): Promise<string[]> {
  const out = await s3.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: `records/${recordId}/` }));
  return (out.Contents ?? []).map((c) => c.Key!).sort();
}

/** A noisy photo-like JPEG with location in its EXIF (so it has real size and metadata). */
export async function jpegWithLocation(width = 1200, height = 900): Promise<Buffer> {
  const noise = Buffer.alloc(width * height * 3);
  for (let i = 0; i < noise.length; i += 1) noise[i] = (i * 7919) % 251;
  return sharp(noise, { raw: { width, height, channels: 3 } }).jpeg({ quality: 90 }).withExif({ IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '45/1 30/1 0/1' } }).toBuffer();
}

/** Posts a photo as a browser would (multipart with its origin); `clientId` is sent when given. */
export async function upload(client: Client, id: number, bytes: Buffer, name: string, type: string, caption?: string, clientId?: string) {
  const form = new FormData();
  form.set('photo', new Blob([new Uint8Array(bytes)], { type }), name);
  if (caption !== undefined) form.set('caption', caption);
  if (clientId !== undefined) form.set('clientId', clientId);
  const request = new Request(`${BASE_URL}/api/records/${id}/photos`, { method: 'POST', body: form });
  // A browser sends its origin with a form post; Astro refuses cross-site form posts without one.
  const headers = { ...Object.fromEntries(request.headers.entries()), origin: client.baseUrl };
  return client.request('POST', `/api/records/${id}/photos`, { body: new Uint8Array(await request.arrayBuffer()), headers });
}

