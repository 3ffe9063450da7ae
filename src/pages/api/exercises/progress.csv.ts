import { requireCan } from '@/lib/server/guards';
import { endpoint } from '@/lib/server/http';
import { progress, progressCsv } from '@/lib/server/practice';

/** The progress table as CSV (UTF-8, CRLF rows), for a spreadsheet. */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'practice.manage');
  return new Response(progressCsv(await progress(person)), {
    headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': 'attachment; filename="practice-progress.csv"', 'cache-control': 'no-store' },
  });
});
