/**
 * The field screen's link to the server: the record as last known (from the server, else from this
 * device's copy), the outbox of what waits, sending when the connection returns, and the time the
 * device was last in step. Keyed by the signed-in person, so a queue waits for that person.
 */
import { useCallback, useEffect, useMemo, useState } from 'react';
import { fetchRecord, send, uploadPhoto } from '@/components/records/record-client';
import type { CrewPerson, EntryView, RecordView } from '@/components/records/types';
import { Outbox, realClock, type FlushOutcome, type Pending, type StampedEntry, type Transport } from './outbox';
import { cachedRecord, idbOutboxStore, keepRecord } from './store';

const sendPhoto: Transport['photo'] = (recordId, file, caption, clientId) => uploadPhoto(recordId, file instanceof File ? file : new File([file], 'photo', { type: file.type }), caption, clientId);

export function useFieldSync(initial: RecordView, me: CrewPerson) {
  const [record, setRecord] = useState(initial);
  const [pending, setPending] = useState<Pending[]>([]);
  const [inStepAt, setInStepAt] = useState<string | null>(null);
  const [sending, setSending] = useState<FlushOutcome>('done');
  const [refresh, setRefresh] = useState(0);
  const outbox = useMemo(() => {
    // A recorded entry joins the record at once, so it never leaves the screen between leaving
    // the outbox and the next reload.
    const transport: Transport = {
      entry: async (recordId, entry) => {
        const result = await send<{ entry: EntryView }>(recordId, entry);
        if (result.ok) setRecord((r) => (r.entries.some((e) => e.clientId === entry.clientId) ? r : { ...r, entries: [...r.entries, result.body.entry] }));
        return result;
      },
      photo: sendPhoto,
    };
    return new Outbox(idbOutboxStore, transport, me.id, initial.id, realClock, () => setRefresh((n) => n + 1));
  }, [me.id, initial.id]);

  useEffect(() => {
    let live = true;
    void outbox.items().then((items) => live && setPending(items)).catch(() => undefined);
    return () => {
      live = false;
    };
  }, [outbox, refresh]);

  /** Asks the server for the record; on success keeps a copy here, in step when nothing waits. */
  const reload = useCallback(async () => {
    const fresh = await fetchRecord<RecordView>(initial.id);
    if (!fresh.ok) return false;
    const waiting = (await outbox.items().catch(() => [])).filter((p) => !p.refused);
    const at = waiting.length ? null : new Date().toISOString();
    // Entries are only ever added: an answer with fewer than shown left before the latest was recorded.
    setRecord((shown) => (fresh.body.record.entries.length >= shown.entries.length ? fresh.body.record : shown));
    if (at) setInStepAt(at);
    const previous = await cachedRecord(me.id, initial.id).catch(() => undefined);
    await keepRecord({ personId: me.id, recordId: initial.id, record: fresh.body.record, inStepAt: at ?? previous?.inStepAt ?? null }).catch(() => undefined);
    return true;
  }, [outbox, me.id, initial.id]);

  const sync = useCallback(async () => {
    setSending(await outbox.flush());
    await reload();
  }, [outbox, reload]);

  useEffect(() => {
    void (async () => {
      const copy = await cachedRecord(me.id, initial.id).catch(() => undefined);
      if (copy) {
        setInStepAt(copy.inStepAt);
        // Offline, the page may come from the worker's cache: this device's copy is at least as new.
        if (copy.record.entries.length > initial.entries.length) setRecord(copy.record);
      }
      await sync();
    })();
    const online = () => void sync();
    window.addEventListener('online', online);
    return () => {
      window.removeEventListener('online', online);
      outbox.stop();
    };
  }, [outbox, sync, me.id, initial.id, initial.entries.length]);

  const addEntry = async (entry: StampedEntry) => {
    await outbox.addEntry(entry);
    void sync();
  };
  const addPhoto = async (file: Blob, caption: string) => {
    await outbox.addPhoto(file, caption, new Date().toISOString(), crypto.randomUUID());
    void sync();
  };
  const dismiss = (key: string) => void outbox.dismiss(key);
  /**
   * Sends what waits and says what is still not recorded: items waiting, and items the server
   * refused that are still on this device (close-out waits for neither).
   */
  const sendAll = async () => {
    setSending(await outbox.flush());
    const items = await outbox.items();
    return { waiting: items.filter((p) => !p.refused).length, refused: items.filter((p) => p.refused) };
  };
  return { record, pending, inStepAt, sending, reload, addEntry, addPhoto, dismiss, sendAll };
}
