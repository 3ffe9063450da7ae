import { getDb } from '../../../../../../db/connection';
import { getRevision } from '../../../../../../db/repositories/revisions';
import { idParam } from '../../../../../lib/schemas/api';
import { AppError } from '../../../../../lib/server/errors';
import { requireUser } from '../../../../../lib/server/guards';
import { endpoint, json, parseWith } from '../../../../../lib/server/http';

/** One revision: its document, report, state and decision (approval with hashes). */
export const GET = endpoint(async (ctx) => {
  const person = requireUser(ctx);
  const revision = await getRevision(getDb(), person.organizationId, parseWith(idParam, ctx.params.id), parseWith(idParam, ctx.params.n));
  if (!revision) throw new AppError('NOT_FOUND');
  return json({ revision });
});
