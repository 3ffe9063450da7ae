import type { APIRoute } from 'astro';
import { QueryTypes } from 'sequelize';
import { getDb } from '@db/connection';
import { json } from '@/lib/server/http';
import { log } from '@/lib/server/log';

// Set by scripts/lib.mjs for each start: the token proves which process answers on the port.
const instance: Record<string, string> = process.env.BONDMAP_INSTANCE ? { 'x-bondmap-instance': process.env.BONDMAP_INSTANCE } : {};

/** 200 when the database answers, 503 when it does not; for load balancers and tests. */
export const GET: APIRoute = async () => {
  try {
    // A typed SELECT: Sequelize 6's raw-query path does not work with mariadb connector 3.5 results.
    await Promise.race([
      getDb().sequelize.query('SELECT 1 AS up', { type: QueryTypes.SELECT }),
      new Promise((_, reject) => setTimeout(() => reject(new Error('timeout')), 3000)),
    ]);
    return json({ ok: true, db: 'up' }, 200, instance);
  } catch (error) {
    log.warn({ err: error }, 'health: database not answering');
    return json({ ok: false, db: 'down' }, 503, { 'retry-after': '5', ...instance });
  }
};
