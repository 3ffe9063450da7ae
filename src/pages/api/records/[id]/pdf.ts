import { getDb } from '@db/connection';
import { getOrganisationSettings } from '@db/repositories/organisation-settings';
import { nameMap } from '@db/repositories/review';
import { z } from 'zod';
import { idParam } from '@/lib/schemas/api';
import { readableRecord } from '@/lib/server/field-records';
import { requireCan } from '@/lib/server/guards';
import { endpoint, parseWith, readQuery } from '@/lib/server/http';
import { getObject } from '@/lib/server/object-store';
import { photoKey } from '@/lib/server/photos';
import { recordPdf } from '@/lib/server/record-pdf';

const query = z.object({ paper: z.enum(['letter', 'a4'], { errorMap: () => ({ message: 'must be letter or a4' }) }).default('letter') });

/** The record as a PDF, Letter unless ?paper=a4. */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'records.view');
  const { paper } = readQuery(ctx.url, query);
  const record = await readableRecord(person, parseWith(idParam, ctx.params.id));
  const ids = record.entries.flatMap((e) => [e.entry.actorId, ...(e.entry.type === 'sign-on' ? e.entry.people : []), ...(e.entry.type === 'briefing' ? [e.entry.by] : [])]);
  const names = await nameMap(getDb(), ids);
  const thumbs = [];
  for (const p of record.photos) {
    const object = await getObject(photoKey(p.objectKey, 'thumb')).catch(() => null);
    if (object) thumbs.push({ caption: p.caption, jpeg: new Uint8Array(await new Response(object.body).arrayBuffer()), width: p.width, height: p.height });
  }
  const { timeZone } = await getOrganisationSettings(getDb(), person.organizationId);
  const bytes = recordPdf({ record, names, thumbs, paper, timeZone });
  return new Response(bytes, {
    headers: { 'content-type': 'application/pdf', 'content-disposition': `attachment; filename="field-record-${record.id}.pdf"`, 'cache-control': 'no-store' },
  });
});
