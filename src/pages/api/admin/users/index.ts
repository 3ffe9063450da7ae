import { getDb } from '@db/connection';
import { listPeople } from '@db/repositories/people';
import { createUserBody } from '@/lib/schemas/api';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, readJson } from '@/lib/server/http';
import { invitePerson } from '@/lib/server/services/people';

export const GET = endpoint(async (ctx) => {
  const admin = requireCan(ctx, 'people.manage');
  return json({ people: await listPeople(getDb(), admin.organizationId) });
});

/**
 * Invites a person to the admin's organisation. The one-time link goes to their mailbox only; the
 * answer says that a mail was sent (and is the same for an address of another organisation).
 */
export const POST = endpoint(async (ctx) => {
  const admin = requireCan(ctx, 'people.manage');
  const body = await readJson(ctx, createUserBody, 16 * 1024);
  return json({ invitation: await invitePerson(admin, body, ctx.url) }, 201);
});
