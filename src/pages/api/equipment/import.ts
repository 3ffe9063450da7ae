import { AppError } from '@/lib/server/errors';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, readLimited } from '@/lib/server/http';
import { importSets } from '@/lib/server/services/equipment';

const LIMIT = 2 * 1024 * 1024;

/**
 * Imports a CSV inventory (admin): all or nothing. Rows whose tag exists update that set; the others
 * are added. Any bad row answers 400 with every problem as `line N.column`, and nothing is saved.
 */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'sets.manage');
  const type = ctx.request.headers.get('content-type') ?? '';
  if (!/^text\/(csv|plain)\b/i.test(type)) throw new AppError('UNSUPPORTED_MEDIA', { message: 'Send the inventory as CSV (Content-Type: text/csv).' });
  if (Number(ctx.request.headers.get('content-length') ?? 0) > LIMIT) throw new AppError('BODY_TOO_LARGE', { extra: { limitBytes: LIMIT } });
  const { created, updated } = await importSets(person, await readLimited(ctx.request, LIMIT));
  return json({ created: created.length, updated: updated.length, items: [...created, ...updated] });
});
