/**
 * Photo upload: the multipart body is read with a hard size limit before anything is stored;
 * the type is found from the content (file-type), never the name; sharp makes a thumbnail and a
 * display size with no metadata (so no location); the original keeps its location only when the
 * organisation allows it, else it is re-encoded without metadata. Objects get random keys. If
 * any step after the first stored object fails, every object stored so far is removed.
 */
import { randomBytes } from 'node:crypto';
import type { APIContext } from 'astro';
import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { getDb } from '@db/connection';
import { addPhoto, keepsPhotoLocation, photoByClientId, type PhotoRow } from '@db/repositories/field-records';
import type { Person } from '@/lib/domain/people';
import { photoFormFields } from '@/lib/schemas/field-record';
import { AppError } from './errors';
import { parseWith, readLimitedBytes } from './http';
import { deleteObjects, ObjectStoreUnavailable, putObject } from './object-store';

export const PHOTO_LIMIT_BYTES = 15 * 1024 * 1024;
/** Room for the multipart boundaries and the caption around the file. */
const BODY_LIMIT_BYTES = PHOTO_LIMIT_BYTES + 64 * 1024;
const TYPES: Record<string, string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp' };
export const PHOTO_SIZES = { thumb: 320, display: 1600 } as const;
export type PhotoSize = keyof typeof PHOTO_SIZES | 'original';

export const photoKey = (base: string, size: PhotoSize) => `${base}/${size}`;

/** The upload's bytes through the shared limited reader; past the limit it is refused by name. */
async function readBody(request: Request): Promise<Buffer> {
  try {
    return await readLimitedBytes(request, BODY_LIMIT_BYTES);
  } catch (error) {
    if (error instanceof AppError && error.code === 'BODY_TOO_LARGE') throw new AppError('PHOTO_TOO_LARGE', { extra: { limitBytes: PHOTO_LIMIT_BYTES }, headers: error.headers });
    throw error;
  }
}

export interface PhotoForm {
  bytes: Buffer;
  caption: string;
  clientId: string | null;
}

/** Reads `photo` (a file), `caption` and `clientId` from a multipart body, refusing anything over the limit. */
export async function readPhotoForm(ctx: APIContext): Promise<PhotoForm> {
  const type = ctx.request.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\b/i.test(type)) throw new AppError('VALIDATION', { issues: [{ path: '(body)', message: 'must be multipart/form-data with the file in the field "photo"' }] });
  const raw = await readBody(ctx.request);
  let form: FormData;
  try {
    form = await new Response(new Uint8Array(raw), { headers: { 'content-type': type } }).formData();
  } catch {
    throw new AppError('VALIDATION', { issues: [{ path: '(body)', message: 'is not a readable multipart form' }] });
  }
  const file = form.get('photo');
  if (!file || typeof file === 'string') throw new AppError('VALIDATION', { issues: [{ path: 'photo', message: 'is required: attach the photo as a file' }] });
  if (file.size > PHOTO_LIMIT_BYTES) throw new AppError('PHOTO_TOO_LARGE', { extra: { limitBytes: PHOTO_LIMIT_BYTES } });
  const fields = parseWith(photoFormFields, { caption: form.get('caption') ?? undefined, clientId: form.get('clientId') ?? undefined });
  return { bytes: Buffer.from(await file.arrayBuffer()), caption: fields.caption ?? '', clientId: fields.clientId ?? null };
}


export interface PhotoObjects {
  base: string;
  keys: string[];
  mime: string;
  bytes: number;
  width: number;
  height: number;
}

/**
 * Checks the content type, then stores the original and the two sizes under a random key below
 * `records/<recordId>/`. Whatever was stored is removed again if a later step fails.
 */
export async function putPhotoObjects(recordId: number, bytes: Buffer, keepLocation: boolean): Promise<PhotoObjects> {
  const found = await fileTypeFromBuffer(bytes);
  if (!found || !TYPES[found.mime]) throw new AppError('PHOTO_TYPE', { extra: { found: found?.mime ?? null } });
  let meta: sharp.Metadata;
  try {
    meta = await sharp(bytes).metadata();
  } catch {
    throw new AppError('PHOTO_UNREADABLE');
  }
  const base = `records/${recordId}/${randomBytes(16).toString('hex')}`;
  const stored: string[] = [];
  const put = async (size: PhotoSize, body: Buffer, mime: string) => {
    await putObject(photoKey(base, size), body, mime);
    stored.push(photoKey(base, size));
  };
  try {
    // The original first: as sent when location may be kept, else re-encoded without metadata.
    // PNG stays lossless: sharp's `quality` on PNG means a 256-colour palette (and ~15 s on a large one).
    const reencode = (image: sharp.Sharp) => (found.mime === 'image/png' ? image.png() : image.toFormat(found.mime === 'image/webp' ? 'webp' : 'jpeg', { quality: 95 }));
    const original = keepLocation ? bytes : await reencode(sharp(bytes).rotate()).toBuffer();
    await put('original', original, found.mime);
    for (const size of ['display', 'thumb'] as const) {
      const edge = PHOTO_SIZES[size];
      const derived = await sharp(bytes).rotate().resize({ width: edge, height: edge, fit: 'inside', withoutEnlargement: true }).jpeg({ quality: size === 'thumb' ? 70 : 82 }).toBuffer();
      await put(size, derived, 'image/jpeg');
    }
    const rotated = (meta.orientation ?? 1) >= 5;
    return { base, keys: stored, mime: found.mime, bytes: original.length, width: (rotated ? meta.height : meta.width) ?? 0, height: (rotated ? meta.width : meta.height) ?? 0 };
  } catch (error) {
    await removeObjects(stored);
    throw storeError(error);
  }
}

async function removeObjects(keys: string[]): Promise<void> {
  await deleteObjects(keys).catch((e) => console.error('[bondmap] could not remove a half-stored photo', keys, e));
}

function storeError(error: unknown): unknown {
  if (error instanceof AppError) return error;
  if (error instanceof ObjectStoreUnavailable || isStoreDown(error)) return new AppError('PHOTO_STORE_DOWN');
  if (isImageError(error)) return new AppError('PHOTO_UNREADABLE');
  return error;
}

/**
 * Stores a photo and its two sizes, then its row (open records only); if the row cannot be added, the objects go. A
 * clientId already stored answers with that photo (created: false) and stores nothing: checked
 * before the objects are put, and again by the unique key, when the objects just put are removed.
 */
export async function storePhoto(person: Person, record: { id: number; status: string }, form: PhotoForm): Promise<{ created: boolean; photo: PhotoRow }> {
  const db = getDb();
  const recordId = record.id;
  const earlier = form.clientId ? await photoByClientId(db, person.organizationId, recordId, form.clientId) : null;
  if (earlier) return { created: false, photo: earlier };
  // A closed record still answers a photo sent again (above), but takes no new one.
  if (record.status === 'closed') throw new AppError('RECORD_CLOSED');
  const objects = await putPhotoObjects(recordId, form.bytes, await keepsPhotoLocation(db, person.organizationId));
  try {
    const row = { clientId: form.clientId, objectKey: objects.base, mime: objects.mime, bytes: objects.bytes, width: objects.width, height: objects.height, caption: form.caption, createdBy: person.id };
    const outcome = await addPhoto(db, person.organizationId, recordId, row);
    if (outcome.kind === 'not-found') throw new AppError('NOT_FOUND');
    if (outcome.kind === 'closed') throw new AppError('RECORD_CLOSED');
    if (outcome.kind === 'repeat') await removeObjects(objects.keys);
    return { created: outcome.kind === 'ok', photo: outcome.photo };
  } catch (error) {
    await removeObjects(objects.keys);
    throw error;
  }
}

const isStoreDown = (error: unknown) => ['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT'].includes((error as { code?: string }).code ?? '') || (error as { name?: string }).name === 'TimeoutError';
const isImageError = (error: unknown) => error instanceof Error && /vips|jpeg|png|webp|corrupt|premature|image/i.test(error.message);
