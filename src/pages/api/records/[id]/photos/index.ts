import { idParam } from '@/lib/schemas/api';
import { readableRecord } from '@/lib/server/field-records';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, parseWith } from '@/lib/server/http';
import { readPhotoForm, storePhoto } from '@/lib/server/photos';

/**
 * Adds a photo (multipart: the file in `photo`, optional `caption` and `clientId`): JPEG, PNG or
 * WebP up to 15 MB. 201 when stored; 200 with the stored photo when its clientId was sent before.
 */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'records.write');
  const recordId = parseWith(idParam, ctx.params.id);
  const record = await readableRecord(person, recordId);
  const form = await readPhotoForm(ctx);
  const { created, photo } = await storePhoto(person, record, form);
  const url = `/api/records/${recordId}/photos/${photo.id}`;
  return json({ id: photo.id, clientId: photo.clientId, caption: photo.caption, mime: photo.mime, bytes: photo.bytes, width: photo.width, height: photo.height, url }, created ? 201 : 200, { location: url });
});
