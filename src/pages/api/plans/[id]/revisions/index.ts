import { getDb } from '../../../../../../db/connection';
import { listRevisions } from '../../../../../../db/repositories/revisions';
import { idParam } from '../../../../../lib/schemas/api';
import { AppError } from '../../../../../lib/server/errors';
import { requireUser } from '../../../../../lib/server/guards';
import { endpoint, json, parseWith } from '../../../../../lib/server/http';

/** Every revision of the plan, newest first, with its counts and decision. */
export const GET = endpoint(async (ctx) => {
  const person = requireUser(ctx);
  const revisions = await listRevisions(getDb(), person.organizationId, parseWith(idParam, ctx.params.id));
  if (!revisions) throw new AppError('NOT_FOUND');
  return json({ revisions });
});
