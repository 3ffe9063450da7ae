import { getDb } from '@db/connection';
import { AppError } from '@/lib/server/errors';
import { importInventory } from '@/lib/server/equipment-pages';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, readLimited } from '@/lib/server/http';

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
  const result = await importInventory(getDb(), person.organizationId, person.id, await readLimited(ctx.request, LIMIT));
  if (!result.ok) throw new AppError('VALIDATION', { message: 'Some rows are not valid; nothing was imported. Fix the cells listed and import the whole file again.', issues: result.issues });
  return json({ created: result.created.length, updated: result.updated.length, items: [...result.created, ...result.updated] });
});
