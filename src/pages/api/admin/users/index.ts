import { getDb } from '../../../../../db/connection';
import { listPeople } from '../../../../../db/repositories/people';
import { createUserBody } from '../../../../lib/schemas/api';
import { requireRole } from '../../../../lib/server/guards';
import { endpoint, json, readJson } from '../../../../lib/server/http';
import { INVITE_DAYS, invitePerson } from '../../../../lib/server/people-admin';
import { publicUrl } from '../../../../lib/server/settings';

export const GET = endpoint(async (ctx) => {
  const admin = requireRole(ctx, 'admin');
  return json({ people: await listPeople(getDb(), admin.organizationId) });
});

/** Adds a person to the admin's organisation and returns their one-time set-password link. */
export const POST = endpoint(async (ctx) => {
  const admin = requireRole(ctx, 'admin');
  const body = await readJson(ctx, createUserBody, 16 * 1024);
  const { person, setPasswordPath } = await invitePerson(admin, body, ctx.url);
  return json({ person, setPasswordUrl: `${publicUrl(ctx.url)}${setPasswordPath}`, expiresInDays: INVITE_DAYS }, 201);
});
