import { idParam } from '../../../../../lib/schemas/api';
import { RECORD_WRITERS, readableRecord } from '../../../../../lib/server/field-records';
import { AppError } from '../../../../../lib/server/errors';
import { requireRole } from '../../../../../lib/server/guards';
import { endpoint, json, parseWith } from '../../../../../lib/server/http';
import { readPhotoForm, storePhoto } from '../../../../../lib/server/photos';

/** Adds a photo (multipart: the file in `photo`, optional `caption`): JPEG, PNG or WebP up to 15 MB. */
export const POST = endpoint(async (ctx) => {
  const person = requireRole(ctx, ...RECORD_WRITERS);
  const recordId = parseWith(idParam, ctx.params.id);
  const record = await readableRecord(person, recordId);
  if (record.status === 'closed') throw new AppError('RECORD_CLOSED');
  const { bytes, caption } = await readPhotoForm(ctx);
  const photo = await storePhoto(person, recordId, bytes, caption);
  const url = `/api/records/${recordId}/photos/${photo.id}`;
  return json({ id: photo.id, caption: photo.caption, mime: photo.mime, bytes: photo.bytes, width: photo.width, height: photo.height, url }, 201, { location: url });
});
