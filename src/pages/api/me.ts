import { requireUser } from '@/lib/server/guards';
import { endpoint, json } from '@/lib/server/http';

export const GET = endpoint((ctx) => json({ person: requireUser(ctx) }));
