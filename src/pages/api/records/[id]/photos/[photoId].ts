import { getDb } from '@db/connection';
import { getPhoto } from '@db/repositories/field-records';
import { idParam } from '@/lib/schemas/api';
import { photoSizeQuery } from '@/lib/schemas/field-record';
import { readableRecord } from '@/lib/server/field-records';
import { AppError } from '@/lib/server/errors';
import { requireCan } from '@/lib/server/guards';
import { endpoint, parseWith, readQuery } from '@/lib/server/http';
import { getObject, ObjectStoreUnavailable } from '@/lib/server/object-store';
import { photoKey } from '@/lib/server/photos';

/** Streams a photo through the app to the organisation's people only: ?size=thumb|display|original */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'records.view');
  const recordId = parseWith(idParam, ctx.params.id);
  await readableRecord(person, recordId);
  const photo = await getPhoto(getDb(), person.organizationId, recordId, parseWith(idParam, ctx.params.photoId));
  if (!photo) throw new AppError('NOT_FOUND');
  const { size } = readQuery(ctx.url, photoSizeQuery);
  let object;
  try {
    object = await getObject(photoKey(photo.objectKey, size));
  } catch (error) {
    if (error instanceof ObjectStoreUnavailable || (error as { code?: string }).code === 'ECONNREFUSED') throw new AppError('PHOTO_STORE_DOWN');
    throw error;
  }
  if (!object) throw new AppError('NOT_FOUND');
  return new Response(object.body, {
    headers: {
      'content-type': object.contentType,
      ...(object.length !== undefined ? { 'content-length': String(object.length) } : {}),
      'cache-control': 'private, max-age=300',
      'x-content-type-options': 'nosniff',
    },
  });
});
