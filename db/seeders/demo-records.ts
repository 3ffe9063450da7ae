/**
 * Invented field records for the demo: on the co-operative's approved plan, one record closed
 * last week and one open today with sets still on. Photos are drawn here (an SVG scene rendered by
 * sharp), never downloaded. Idempotent: an organisation that has records is left alone.
 */
import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { inventorySetStatus, judgeAppend, judgeCloseOut, type EntryBody, type FieldEntry } from '@/lib/domain/field-record';
import { objectStoreSettings } from '@/lib/server/object-store';
import { putPhotoObjects } from '@/lib/server/photos';
import type { Db } from '@db/connection';
import type { FieldRecordEntry } from '@db/models';
import { allSets } from '@db/repositories/equipment';
import { addEntry, addPhoto, closeRecord, createRecord } from '@db/repositories/field-records';

/** A drawn scene: a pole, a crossarm with three conductors, a cluster bar and ground leads. */
function scene(hue: number, leads: number): string {
  const wires = [90, 200, 310].map((x) => `<line x1="${x}" y1="150" x2="${x}" y2="${215}" stroke="#2d2d2d" stroke-width="5"/>`).join('');
  const jumpers = [90, 200, 310].slice(0, leads).map((x) => `<path d="M${x} 215 Q ${(x + 200) / 2} 300 200 330" fill="none" stroke="#3a3a3a" stroke-width="6"/>`).join('');
  return `<svg xmlns="http://www.w3.org/2000/svg" width="600" height="900" viewBox="0 0 400 600">
    <defs><linearGradient id="sky" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="hsl(${hue},55%,72%)"/><stop offset="1" stop-color="hsl(${hue},40%,90%)"/></linearGradient></defs>
    <rect width="400" height="600" fill="url(#sky)"/>
    <rect y="520" width="400" height="80" fill="#6b7d4a"/>
    <rect x="188" y="120" width="24" height="420" fill="#7b5a3a"/>
    <rect x="60" y="140" width="280" height="14" fill="#5c4330"/>
    ${wires}
    <rect x="150" y="322" width="100" height="16" rx="4" fill="#9aa3ad" stroke="#444" stroke-width="2"/>
    ${jumpers}
    <path d="M200 338 L200 520" stroke="#3a3a3a" stroke-width="6"/>
  </svg>`;
}

const at = (day: Date, minutes: number) => new Date(day.getTime() + minutes * 60_000).toISOString();

export async function seedDemoRecords(db: Db, organizationId: number, planId: number, leadId: string, apprenticeId: string): Promise<number> {
  if ((await db.models.FieldRecord.count({ where: { organizationId } })) > 0) return 0;
  const today = new Date();
  today.setUTCHours(7, 0, 0, 0);
  const lastWeek = new Date(today.getTime() - 7 * 86_400_000);
  const plan = await db.models.Plan.findByPk(planId);
  if (!plan || plan.status !== 'approved') return 0;

  const open = async (day: Date, clearanceRef: string) => {
    const outcome = await createRecord(db, organizationId, { planId, leadId, workDate: day.toISOString().slice(0, 10), location: 'Wren Hollow Road, invented', clearanceRef, detector: 'Invented detector 7' });
    if (outcome.kind !== 'ok') throw new Error(`demo record cannot be opened: ${outcome.kind}`);
    return outcome.record.id;
  };
  // Judged against the demo inventory (seeded first), as the server judges: a tag here that is not
  // an in-date set of the co-operative stops the seed rather than leave a record no crew could make.
  const sets = inventorySetStatus(await allSets(db, organizationId), today.toISOString().slice(0, 10));
  const write = async (recordId: number, day: Date, bodies: EntryBody[]) => {
    let minute = 0;
    for (const body of bodies) {
      const entry = { ...body, clientId: randomUUID(), at: at(day, (minute += 4)), actorId: leadId } as FieldEntry;
      const outcome = await addEntry(db, organizationId, recordId, entry, (document, entries, closed) => judgeAppend(document, entries, closed, sets));
      if (outcome.kind !== 'created') throw new Error(`demo entry ${body.type} was not recorded: ${outcome.kind}`);
    }
  };
  const photo = async (recordId: number, hue: number, leads: number, caption: string) => {
    if (!objectStoreSettings()) return;
    const jpeg = await sharp(Buffer.from(scene(hue, leads))).jpeg({ quality: 85 }).toBuffer();
    const objects = await putPhotoObjects(recordId, jpeg, false);
    await addPhoto(db, organizationId, recordId, { objectKey: objects.base, mime: objects.mime, bytes: objects.bytes, width: objects.width, height: objects.height, caption, createdBy: leadId });
  };

  const briefing: EntryBody[] = (['plan-reviewed', 'hazards-discussed', 'sets-inspected', 'contacts-cleaned', 'detector-proved'] as const).map((item) => ({ type: 'briefing', item, by: leadId }));
  const start: EntryBody[] = [
    { type: 'sign-on', people: [leadId, apprenticeId], visitors: ['Wendeline Ossory (invented visiting inspector)'] },
    ...briefing,
    { type: 'voltage-test', detector: 'Invented detector 7', detectorCheckedBefore: true, detectorCheckedAfter: true, phases: { A: 'absent', B: 'absent', C: 'absent' } },
  ];
  const on = (link: string, tag: string): EntryBody => ({ type: 'install', link, setTag: tag, groundEndFirst: true });

  const closedId = await open(lastWeek, 'HOLD-DEMO-0117');
  await write(closedId, lastWeek, [
    ...start,
    on('jN', 'LV-104'), on('jA', 'LV-101'), on('jB', 'LV-102'), on('jC', 'LV-103'), on('jBK', 'LV-107'),
    { type: 'deviation', text: 'Bucket lead rerouted around the street-light arm; same cluster bar.' },
    { type: 'remove', link: 'jBK' }, { type: 'remove', link: 'jC' }, { type: 'remove', link: 'jA' }, { type: 'remove', link: 'jB' }, { type: 'remove', link: 'jN' },
  ]);
  await photo(closedId, 205, 3, 'All three phases to the cluster bar (drawn for the demo)');
  const closed = await closeRecord(db, organizationId, closedId, leadId, judgeCloseOut);
  if (closed.kind !== 'ok') throw new Error(`demo record cannot be closed: ${closed.kind}`);
  // Closed out on its own day, just after the last set came off, not when the demo is seeded.
  const last = await db.models.FieldRecordEntry.max<Date, FieldRecordEntry>('at', { where: { recordId: closedId } });
  await db.models.FieldRecord.update({ closedAt: new Date(new Date(last).getTime() + 8 * 60_000) }, { where: { id: closedId } });

  const openId = await open(today, 'HOLD-DEMO-0123');
  await write(openId, today, [...start, on('jN', 'LV-106'), on('jA', 'LV-105'), on('jB', 'LV-109')]);
  await photo(openId, 35, 2, 'Neutral, A and B on; C next (drawn for the demo)');
  return 2;
}
