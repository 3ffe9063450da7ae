/**
 * Opening a field record, for POST /api/plans/:id/records and the plan page's "Start field
 * record" form. The record's other operations are the API's alone (src/lib/server/field-records.ts).
 */
import type { z } from 'zod';
import { getDb } from '@db/connection';
import { createRecord } from '@db/repositories/field-records';
import type { Person } from '@/lib/domain/people';
import type { createRecordBody } from '@/lib/schemas/field-record';
import { getOrganisationSettings } from '@db/repositories/organisation-settings';
import { formatDate } from '@/lib/time-format';
import { AppError } from '@/lib/server/errors';
import { assertCan } from '@/lib/server/guards';

/** Opens a record on the plan's approved revision, for the work date given or today in the organisation's time zone. */
export async function openRecord(person: Person, planId: number, input: z.infer<typeof createRecordBody>, now = new Date()) {
  assertCan(person, 'records.write');
  const workDate = input.workDate ?? formatDate(now, (await getOrganisationSettings(getDb(), person.organizationId)).timeZone);
  const outcome = await createRecord(getDb(), person.organizationId, {
    planId,
    leadId: person.id,
    workDate,
    location: input.location ?? '',
    clearanceRef: input.clearanceRef ?? '',
    detector: input.detector ?? '',
  });
  if (outcome.kind === 'not-found') throw new AppError('NOT_FOUND');
  if (outcome.kind === 'not-approved') throw new AppError('RECORD_PLAN_NOT_APPROVED', { extra: { status: outcome.status } });
  return outcome.record;
}
