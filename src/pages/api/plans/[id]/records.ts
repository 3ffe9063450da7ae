import { createRecordBody } from '@/lib/schemas/field-record';
import { idParam } from '@/lib/schemas/api';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, parseWith, readJson } from '@/lib/server/http';
import { openRecord } from '@/lib/server/services/records';

/** Opens a field record on the plan's approved revision: 201, or 409 unless the plan is approved. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'records.write');
  const planId = parseWith(idParam, ctx.params.id);
  const hasBody = Number(ctx.request.headers.get('content-length') ?? 0) > 0 || ctx.request.headers.has('transfer-encoding');
  const body = hasBody ? await readJson(ctx, createRecordBody) : {};
  const record = await openRecord(person, planId, body);
  return json({ id: record.id, planId: record.planId, revision: record.revision, status: record.status, workDate: record.workDate }, 201, { location: `/api/records/${record.id}` });
});
