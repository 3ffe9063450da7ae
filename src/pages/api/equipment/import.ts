import { getDb } from '../../../../db/connection';
import { saveSets } from '../../../../db/repositories/equipment';
import { parseInventoryCsv } from '../../../lib/schemas/equipment-csv';
import { AppError } from '../../../lib/server/errors';
import { today, unwrap } from '../../../lib/server/equipment-http';
import { requireRole } from '../../../lib/server/guards';
import { endpoint, json, readLimited } from '../../../lib/server/http';

const LIMIT = 2 * 1024 * 1024;

/**
 * Imports a CSV inventory (admin): all or nothing. Rows whose tag exists update that set; the others
 * are added. Any bad row answers 400 with every problem as `line N.column`, and nothing is saved.
 */
export const POST = endpoint(async (ctx) => {
  const person = requireRole(ctx, 'admin');
  const type = ctx.request.headers.get('content-type') ?? '';
  if (!/^text\/(csv|plain)\b/i.test(type)) throw new AppError('UNSUPPORTED_MEDIA', { message: 'Send the inventory as CSV (Content-Type: text/csv).' });
  if (Number(ctx.request.headers.get('content-length') ?? 0) > LIMIT) throw new AppError('BODY_TOO_LARGE', { extra: { limitBytes: LIMIT } });
  const parsed = parseInventoryCsv(await readLimited(ctx.request, LIMIT));
  if (!parsed.ok) throw new AppError('VALIDATION', { message: 'Some rows are not valid; nothing was imported. Fix the cells listed and import the whole file again.', issues: parsed.issues });
  const day = today();
  const future = parsed.rows.filter((r) => r.body.lastTestedOn && r.body.lastTestedOn > day);
  if (future.length) throw new AppError('VALIDATION', { issues: future.map((r) => ({ path: `line ${r.line}.lastTestedOn`, message: 'must not be in the future' })) });
  const { created, updated } = unwrap(await saveSets(getDb(), person.organizationId, person.id, parsed.rows.map((r) => r.body), 'upsert'));
  return json({ created: created.length, updated: updated.length, items: [...created, ...updated] });
});
