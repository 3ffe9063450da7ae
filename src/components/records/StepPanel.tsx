/**
 * The next expected step as the one primary action: big targets, few words. Each form sends one
 * entry through record-client; the parent reloads the record after every answer.
 */
import { useState, type ReactNode } from 'react';
import { BRIEFING_LABELS, type EntryBody } from '@/lib/domain/field-record';
import { formatDateTime } from '@/lib/time-format';
import { firstChoice, SetChoice } from './SetChoice';
import type { CrewPerson, RecordView } from './types';

const BIG = 'min-h-[56px] w-full rounded-lg px-4 text-lg font-semibold';
export const PRIMARY = `${BIG} bg-accent text-white hover:bg-accent-dark disabled:opacity-50`;
export const SECONDARY = `${BIG} border-2 border-line bg-white text-ink hover:bg-paper`;
const CHECK = 'flex min-h-[56px] items-center gap-3 rounded-lg border-2 border-line bg-white px-4 text-lg';

function Card({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="space-y-3 rounded-xl border-2 border-accent bg-white p-4" aria-label="Next step" data-testid="next-step">
      <h2 className="text-xl font-bold">{title}</h2>
      {children}
    </section>
  );
}

export interface StepProps {
  record: RecordView;
  people: CrewPerson[];
  me: CrewPerson;
  busy: boolean;
  submit: (body: EntryBody) => void;
  onClose: () => void;
  /** The organisation's time zone: the close-out time is read in it. */
  timeZone?: string;
}

function SignOn({ people, me, busy, submit }: StepProps) {
  const [picked, setPicked] = useState<string[]>([me.id]);
  const [visitor, setVisitor] = useState('');
  const toggle = (id: string) => setPicked((p) => (p.includes(id) ? p.filter((x) => x !== id) : [...p, id]));
  return (
    <Card title="Sign on the crew">
      {people.map((p) => (
        <label key={p.id} className={CHECK}>
          <input type="checkbox" className="h-7 w-7" checked={picked.includes(p.id)} onChange={() => toggle(p.id)} /> {p.name}
        </label>
      ))}
      <label className="block text-lg">Visitor (name)<input className="mt-1 min-h-[56px] w-full rounded-lg border-2 border-line px-3" value={visitor} onChange={(e) => setVisitor(e.target.value)} /></label>
      <button type="button" className={PRIMARY} disabled={busy || picked.length + (visitor.trim() ? 1 : 0) === 0} onClick={() => submit({ type: 'sign-on', people: picked, visitors: visitor.trim() ? [visitor.trim()] : [] })}>Sign on</button>
    </Card>
  );
}

function Briefing({ record, people, me, busy, submit }: StepProps & { item: keyof typeof BRIEFING_LABELS }) {
  const crew = [...people.filter((p) => record.entries.some((e) => e.type === 'sign-on' && e.people.includes(p.id))).map((p) => ({ value: p.id, label: p.name })), ...record.entries.flatMap((e) => (e.type === 'sign-on' ? e.visitors.map((v) => ({ value: v, label: `${v} (visitor)` })) : []))];
  const [by, setBy] = useState(crew.some((c) => c.value === me.id) ? me.id : crew[0]?.value ?? me.id);
  const item = (record.next as { item: keyof typeof BRIEFING_LABELS }).item;
  return (
    <Card title="Briefing">
      <p className="text-lg">{BRIEFING_LABELS[item]}</p>
      <label className="block text-lg">Ticked by<select className="mt-1 min-h-[56px] w-full rounded-lg border-2 border-line px-3" value={by} onChange={(e) => setBy(e.target.value)}>{crew.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}</select></label>
      <button type="button" className={PRIMARY} disabled={busy} onClick={() => submit({ type: 'briefing', item, by })}>Tick</button>
    </Card>
  );
}

function VoltageTest({ record, busy, submit }: StepProps) {
  const [detector, setDetector] = useState(record.detector);
  const [phases, setPhases] = useState<Record<string, 'absent' | 'present'>>({});
  const [before, setBefore] = useState(false);
  const [after, setAfter] = useState(false);
  // A clear test needs every phase absent and the detector proved before and after. Voltage found
  // is recorded at once, as it stands: the crew stops, and nothing has to be ticked first.
  const found = Object.values(phases).includes('present');
  const complete = detector.trim() && (found || (record.plan.phases.every((p) => phases[p]) && before && after));
  return (
    <Card title="Test for voltage">
      <label className="block text-lg">Detector<input className="mt-1 min-h-[56px] w-full rounded-lg border-2 border-line px-3" value={detector} onChange={(e) => setDetector(e.target.value)} /></label>
      <label className={CHECK}><input type="checkbox" className="h-7 w-7" checked={before} onChange={(e) => setBefore(e.target.checked)} /> Detector proved before</label>
      {record.plan.phases.map((p) => (
        <div key={p} className="grid grid-cols-[minmax(3rem,auto)_1fr_1fr] items-center gap-2" role="group" aria-label={`Phase ${p}`}>
          <span className="text-xl font-bold">{p}</span>
          {(['absent', 'present'] as const).map((r) => (
            <button key={r} type="button" aria-pressed={phases[p] === r} className={`${BIG} border-2 ${phases[p] === r ? (r === 'present' ? 'border-blocker bg-blocker text-white' : 'border-clear bg-clear text-white') : 'border-line bg-white'}`} onClick={() => setPhases((s) => ({ ...s, [p]: r }))}>
              {r === 'absent' ? 'Absent' : 'Present'}
            </button>
          ))}
        </div>
      ))}
      <label className={CHECK}><input type="checkbox" className="h-7 w-7" checked={after} onChange={(e) => setAfter(e.target.checked)} /> Detector proved after</label>
      {found && <p className="rounded-lg bg-blocker p-3 text-lg font-bold text-white" role="alert">Voltage found. Record it now and stop: no set goes on.</p>}
      <button type="button" className={PRIMARY} disabled={busy || !complete} onClick={() => submit({ type: 'voltage-test', detector: detector.trim(), detectorCheckedBefore: before, detectorCheckedAfter: after, phases })}>Record test</button>
    </Card>
  );
}

function Install({ record, busy, submit }: StepProps) {
  const link = (record.next as { link: string }).link;
  const jumper = record.plan.jumpers.find((j) => j.id === link);
  const [tag, setTag] = useState(() => firstChoice(record, link));
  const [groundFirst, setGroundFirst] = useState(false);
  return (
    <Card title={`Set on: ${link}`}>
      <p className="text-lg text-note">{jumper?.label}</p>
      <SetChoice record={record} link={link} value={tag} onChange={setTag} />
      <label className={CHECK}><input type="checkbox" className="h-7 w-7" checked={groundFirst} onChange={(e) => setGroundFirst(e.target.checked)} /> Ground end on first; line end with a live-line tool</label>
      <button type="button" className={PRIMARY} disabled={busy || !tag.trim() || !groundFirst} onClick={() => { submit({ type: 'install', link, setTag: tag.trim(), groundEndFirst: true }); setTag(''); setGroundFirst(false); }}>Set on</button>
    </Card>
  );
}

export function StepPanel(props: StepProps) {
  const { record, busy, submit, onClose } = props;
  const next = record.next;
  switch (next.kind) {
    case 'sign-on':
      return <SignOn {...props} />;
    case 'briefing':
      return <Briefing key={next.item} {...props} item={next.item} />;
    case 'voltage-test':
      return <VoltageTest {...props} />;
    case 'install':
      return <Install key={next.link} {...props} />;
    case 'remove':
      return (
        <Card title={`Take off: ${next.link}`}>
          {record.voltageFound && <p className="rounded-lg bg-blocker p-3 text-lg font-bold text-white" role="alert">Voltage found. Stop work. Call the system operator.</p>}
          <p className="text-lg">Line end first, ground end last.</p>
          <button type="button" className={PRIMARY} disabled={busy} onClick={() => submit({ type: 'remove', link: next.link })}>Set off</button>
        </Card>
      );
    case 'close':
      return (
        <Card title="Close out">
          <p className="text-lg">Every set that went on is off. Closing tells the office the clearance can be released.</p>
          <button type="button" className={PRIMARY} disabled={busy} onClick={onClose}>Close out</button>
        </Card>
      );
    case 'stop':
      return <p className="rounded-xl bg-blocker p-4 text-xl font-bold text-white" role="alert" data-testid="next-step">Voltage found. Stop: no set goes on. Call the system operator.</p>;
    case 'closed':
      return <p className="rounded-xl border-2 border-clear bg-white p-4 text-xl font-bold" data-testid="next-step">Closed out by {record.closedBy?.name}{record.closedAt && props.timeZone ? ` at ${formatDateTime(new Date(record.closedAt), props.timeZone)}` : ''}. Nothing more can be recorded.</p>;
  }
}
