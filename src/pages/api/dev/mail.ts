import { AppError } from '@/lib/server/errors';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json } from '@/lib/server/http';
import { caughtMailFor } from '@/lib/server/mail';
import { settings } from '@/lib/server/settings';

/** The messages the local mail catcher received (only while the app uses it; admins only). */
export const GET = endpoint(async (ctx) => {
  const admin = requireCan(ctx, 'mail.read');
  if (settings().BONDMAP_MAIL_CATCHER !== '1') throw new AppError('NOT_FOUND');
  return json({ messages: await caughtMailFor(admin.organizationId, ctx.url.searchParams.get('to')) });
});
