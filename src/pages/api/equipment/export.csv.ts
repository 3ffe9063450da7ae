import { getDb } from '@db/connection';
import { allSets } from '@db/repositories/equipment';
import { inventoryToCsv } from '@/lib/schemas/equipment-csv';
import { requireCan } from '@/lib/server/guards';
import { endpoint } from '@/lib/server/http';

/** The whole inventory as CSV, in the format the import and `npm run check -- --equipment` read. */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'sets.view');
  const csv = inventoryToCsv(await allSets(getDb(), person.organizationId));
  return new Response(csv, {
    headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': 'attachment; filename="grounding-sets.csv"', 'cache-control': 'no-store' },
  });
});
