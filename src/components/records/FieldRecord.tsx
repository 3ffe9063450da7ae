/**
 * The field screen island (/records/[id]): the count of sets on and off always in view, the next
 * expected step as the primary action, the drawing above the log on a tablet, one column on a
 * phone. Every write goes through record-client; the record is reloaded after each answer.
 */
import { useEffect, useState } from 'react';
import { registerWorker } from '@/components/offline/register-worker';
import type { EntryBody } from '@/lib/domain/field-record';
import { judgeOnDevice, withPending } from './offline/local-view';
import { SyncBar } from './offline/SyncBar';
import { useFieldSync } from './offline/use-field-sync';
import { closeRecord, stampEntry, type ApiFailure, type ApiResult } from './record-client';
import { FieldDrawing } from './FieldDrawing';
import { RecordLog } from './RecordLog';
import { PRIMARY, SECONDARY, StepPanel } from './StepPanel';
import type { CrewPerson, RecordView } from './types';

export interface FieldRecordProps {
  initial: RecordView;
  people: CrewPerson[];
  me: CrewPerson;
  canWrite: boolean;
  /** The organisation's time zone: the log shows each entry's time in it. */
  timeZone: string;
}

export default function FieldRecord({ initial, people, me, canWrite, timeZone }: FieldRecordProps) {
  const sync = useFieldSync(initial, me);
  const record = withPending(sync.record, sync.pending, me);
  useEffect(() => void registerWorker(), []);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<ApiFailure | null>(null);
  const [text, setText] = useState('');
  const [caption, setCaption] = useState('');
  const [file, setFile] = useState<File | null>(null);
  const open = record.status === 'open' && canWrite;

  const act = async (work: () => Promise<ApiResult<unknown>>) => {
    setBusy(true);
    setProblem(null);
    const result = await work();
    if (!result.ok) setProblem(result);
    await sync.reload();
    setBusy(false);
    return result.ok;
  };
  /** Judged here first (the same rules and words as the server), then kept in the outbox and sent. */
  const submit = (body: EntryBody) => {
    const stamped = stampEntry(body);
    const refusal = judgeOnDevice(record, { ...stamped, actorId: me.id } as Parameters<typeof judgeOnDevice>[1]);
    setProblem(refusal ? { ok: false, status: 409, code: refusal.code, message: refusal.message, items: refusal.items } : null);
    if (!refusal) void sync.addEntry(stamped);
  };
  // The server closes out only when every set is off there: what waits here goes first. An entry
  // the server refused is not on its record, but what it says happened may have happened: a set
  // put on here and refused there may still be on the line, so close-out waits until the crew has
  // read each refusal and taken it off this device.
  const onClose = () =>
    void act(async () => {
      const { waiting, refused } = await sync.sendAll();
      if (waiting) return { ok: false, status: 0, code: 'OFFLINE', message: `${waiting} entries or photos still wait to be sent. Close out once they have gone (it needs a connection).` };
      if (refused.length) {
        const sets = refused.flatMap((p) => (p.kind === 'entry' && p.entry.type === 'install' ? [`${p.entry.setTag} on ${p.entry.link}`] : []));
        const message = sets.length
          ? `The server refused a set recorded on this device as going on (${sets.join(', ')}), so its record does not count it. Make sure it is off the line and record what happened as a deviation; then remove the refused entry from this device (in the log) and close out.`
          : `The server refused ${refused.length === 1 ? 'an entry' : `${refused.length} entries`} made on this device. Read each refusal in the log and remove it from this device, then close out.`;
        return { ok: false, status: 409, code: 'REFUSED_ON_DEVICE', message };
      }
      return closeRecord(record.id);
    });

  return (
    <div className="mx-auto max-w-3xl space-y-4" data-testid="field-record" data-status={record.status}>
      <div className="sticky top-0 z-10 -mx-4 grid grid-cols-2 gap-2 border-b border-line bg-paper px-4 py-2" aria-live="polite">
        <p className="rounded-lg bg-white p-2 text-center"><span className="block text-3xl font-bold num" data-testid="count-on">{record.counts.on}</span> sets on now</p>
        <p className="rounded-lg bg-white p-2 text-center"><span className="block text-3xl font-bold num" data-testid="count-off">{record.counts.removed}</span> off of {record.counts.installed}</p>
      </div>

      <SyncBar pending={sync.pending} inStepAt={sync.inStepAt} sending={sync.sending} timeZone={timeZone} />

      {problem && (
        <div className="rounded-lg border-2 border-blocker bg-white p-3 text-lg" role="alert" data-testid="problem">
          <strong>Not recorded.</strong> {problem.message}{problem.items?.length ? ` (${problem.items.join(', ')})` : ''}
          {problem.issues?.map((i) => <span key={i.path} className="block text-base">{i.path}: {i.message}</span>)}
        </div>
      )}

      {canWrite || record.status === 'closed' ? <StepPanel record={record} people={people} me={me} busy={busy} submit={submit} onClose={onClose} timeZone={timeZone} /> : <p className="text-note">Read only: your role may view this record.</p>}

      {/* A crew must always be able to take grounds off, whatever the next expected step is. */}
      {open && record.setsOn.some((s) => !('link' in record.next) || s.link !== record.next.link) && (
        <section className="space-y-2" aria-label="Other sets on">
          <h2 className="text-lg font-semibold">Take off a set</h2>
          {record.setsOn.filter((s) => !('link' in record.next) || s.link !== record.next.link).map((s) => (
            <button key={s.link} type="button" className={SECONDARY} disabled={busy} onClick={() => submit({ type: 'remove', link: s.link })}>Set off {s.link} ({s.setTag})</button>
          ))}
        </section>
      )}

      <div className="hidden md:block">
        <FieldDrawing document={record.document} on={record.setsOn.map((s) => s.link)} />
        <p className="mt-1 text-sm text-note">Highlighted jumpers have a set on now.</p>
      </div>

      {open && (
        <details className="rounded-xl border-2 border-line bg-white p-4" data-testid="photo-panel">
          <summary className="min-h-[56px] cursor-pointer text-lg font-semibold leading-[56px]">Add a photo</summary>
          <label className="block text-lg">Photo<input type="file" accept="image/jpeg,image/png,image/webp" capture="environment" className="mt-1 block min-h-[56px] w-full" onChange={(e) => setFile(e.target.files?.[0] ?? null)} /></label>
          <label className="block text-lg">Caption<input className="mt-1 min-h-[56px] w-full rounded-lg border-2 border-line px-3" value={caption} onChange={(e) => setCaption(e.target.value)} /></label>
          <button type="button" className={`${PRIMARY} mt-3`} disabled={busy || !file} onClick={() => file && void sync.addPhoto(file, caption).then(() => (setFile(null), setCaption('')))}>Upload photo</button>
        </details>
      )}

      {open && (
        <details className="rounded-xl border-2 border-line bg-white p-4">
          <summary className="min-h-[56px] cursor-pointer text-lg font-semibold leading-[56px]">Deviation or note</summary>
          <label className="block text-lg">What is different, or what to note<textarea className="mt-1 min-h-[112px] w-full rounded-lg border-2 border-line p-3" value={text} onChange={(e) => setText(e.target.value)} /></label>
          <div className="mt-3 grid grid-cols-2 gap-2">
            <button type="button" className={SECONDARY} disabled={busy || !text.trim()} onClick={() => { submit({ type: 'deviation', text: text.trim() }); setText(''); }}>Deviation</button>
            <button type="button" className={SECONDARY} disabled={busy || !text.trim()} onClick={() => { submit({ type: 'note', text: text.trim() }); setText(''); }}>Note</button>
          </div>
          <p className="mt-2 text-sm text-note">A deviation is mailed to the plan's reviewer.</p>
        </details>
      )}

      <a className={`${SECONDARY} flex items-center justify-center`} href={`/api/records/${record.id}/pdf`} download data-testid="pdf-link">Download PDF</a>

      <RecordLog record={record} people={people} timeZone={timeZone} onDismiss={sync.dismiss} />
    </div>
  );
}
