/**
 * Reading the body of a plain HTML form (the pages that work without JavaScript). Anything but a
 * form body is refused with a page saying so — never a 500 — and no body is read past the limit.
 */
import { AppError } from './errors';
import { plainPage } from './pages';
import { readLimitedBytes } from './http';

/** Our forms hold a few short fields; 64 KiB is far above any honest post. */
export const FORM_BODY_LIMIT = 64 * 1024;

const FORM_TYPES = /^(application\/x-www-form-urlencoded|multipart\/form-data)\b/i;

/** The posted form, or a refusal page (415 not a form, 413 too large, 400 unreadable) to return as is. */
export async function readForm(request: Request, limitBytes = FORM_BODY_LIMIT): Promise<FormData | Response> {
  const type = request.headers.get('content-type') ?? '';
  if (!FORM_TYPES.test(type)) {
    return plainPage(415, 'Not a form', 'This address takes the form on its page, sent by your browser. Nothing was changed; go back and send the form again.');
  }
  let bytes: Buffer;
  try {
    bytes = await readLimitedBytes(request, limitBytes);
  } catch (error) {
    if (error instanceof AppError && error.code === 'BODY_TOO_LARGE') {
      return plainPage(413, 'Too much sent', `The form sent more than ${Math.round(limitBytes / 1024)} KiB, so it was not read and nothing was changed.`, { connection: 'close' });
    }
    throw error;
  }
  try {
    return await new Response(new Uint8Array(bytes), { headers: { 'content-type': type } }).formData();
  } catch {
    return plainPage(400, 'The form could not be read', 'The form arrived damaged, so nothing was changed. Go back and send it again.');
  }
}
