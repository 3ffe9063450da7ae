import type { APIRoute } from 'astro';
import { signOut } from '@/lib/server/auth';

/** The sign-out button's form posts here; the session ends and the browser goes to /login. */
export const POST: APIRoute = async (ctx) => {
  await signOut(ctx);
  return ctx.redirect('/login', 303);
};
