/** The field record's messages: a deviation to the plan's reviewer; the close-out summary. */
import type { RecordDetail } from '@db/repositories/field-records';
import { BRIEFING_ITEMS, replay, recordPlanFrom } from '@/lib/domain/field-record';
import type { OutgoingMail } from './mail';
import { formatTime } from '@/lib/time-format';
import { compose } from './mail-messages';

const recordLink = (baseUrl: string, id: number) => ({ href: `${baseUrl}/records/${id}`, label: 'Open the field record' });

export function deviationMessage(to: string, record: RecordDetail, organizationId: number, byName: string, text: string, baseUrl: string): OutgoingMail {
  return compose({
    to,
    subject: `Field deviation: ${record.planTitle}`,
    kind: 'record.deviation',
    organizationId,
    lines: [
      `${byName} recorded a deviation from the approved plan "${record.planTitle}" (revision ${record.revision}) at ${record.structure || 'the structure'} on ${record.workDate}:`,
      `"${text}"`,
      'The field does not match the plan you approved; please get in touch with the crew lead.',
    ],
    link: recordLink(baseUrl, record.id),
  });
}

/** The close-out summary: who closed, counts, flags and deviations (times in the organisation's zone). */
export function closedMessages(to: string[], record: RecordDetail, organizationId: number, byName: string, baseUrl: string, timeZone: string): OutgoingMail[] {
  const state = replay(recordPlanFrom(record.document), record.entries.map((e) => e.entry), true);
  const flags = record.entries.flatMap((e) => e.flags.map((f) => `${formatTime(new Date(e.entry.at), timeZone)} ${f.message}`));
  const deviations = record.entries.filter((e) => e.entry.type === 'deviation').map((e) => ('text' in e.entry ? e.entry.text : ''));
  const briefed = BRIEFING_ITEMS.filter((i) => state.briefing[i]).length;
  const lines = [
    `${byName} closed out the field record for "${record.planTitle}" (revision ${record.revision}) at ${record.structure || 'the structure'} on ${record.workDate}.`,
    `Every set that went on has come off: ${state.installed} on, ${state.removed} off. The clearance${record.clearanceRef ? ` ${record.clearanceRef}` : ''} can be released to the system operator.`,
    `Briefing: ${briefed} of ${BRIEFING_ITEMS.length} items ticked. Crew signed on: ${state.people.length} people and ${state.visitors.length} visitors. Photos: ${record.photos.length}.`,
    flags.length ? `Flags: ${flags.join('; ')}` : 'No flags were raised.',
    deviations.length ? `Deviations: ${deviations.join('; ')}` : 'No deviations were recorded.',
  ];
  return to.map((address) => compose({ to: address, subject: `Closed out: ${record.planTitle}`, kind: 'record.closed', organizationId, lines, link: recordLink(baseUrl, record.id) }));
}
