import { idParam } from '@/lib/schemas/api';
import { attemptBody } from '@/lib/schemas/practice';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, parseWith, readJson } from '@/lib/server/http';
import { attempt } from '@/lib/server/practice';

/** `{answer}` → `{score, found, missed, wrong, explanation}`; every attempt is kept. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'practice.take');
  const id = parseWith(idParam, ctx.params.id);
  const body = await readJson(ctx, attemptBody, 2 * 1024 * 1024);
  return json(await attempt(person, id, body.answer), 201);
});
