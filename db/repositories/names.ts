/** People's display names by id, for lists that show who did what. */
import type { Transaction } from 'sequelize';
import type { Db } from '@db/connection';

export async function nameMap(db: Db, ids: string[], transaction?: Transaction): Promise<Map<string, string>> {
  const unique = [...new Set(ids)];
  if (!unique.length) return new Map();
  const rows = await db.models.User.findAll({ where: { id: unique }, attributes: ['id', 'name'], transaction });
  return new Map(rows.map((r) => [r.id, r.name]));
}
