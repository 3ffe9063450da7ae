/** The editor's draft mirror: synchronous reads, every write passed on to the device store in order. */
import { describe, expect, it } from 'vitest';
import { mirrorStorage } from '@/components/editor/draft-store';
import { clearLocalDrafts, draftKey, readLocalDraft } from '@/components/editor/sync';

describe('the draft mirror', () => {
  it('answers the editor synchronously and writes through in call order', () => {
    const writes: string[] = [];
    const old = JSON.stringify({ doc: { title: 'old' }, savedAt: '2026-05-04T07:00:00Z' });
    const storage = mirrorStorage([[draftKey(7, 2), old], ['other', 'x']], { put: (k) => writes.push(`put ${k}`), remove: (k) => writes.push(`remove ${k}`) });
    expect(readLocalDraft(storage, 7)).toMatchObject({ baseRevision: 2, doc: { title: 'old' } });
    clearLocalDrafts(storage, 7);
    storage.setItem(draftKey(7, 3), JSON.stringify({ doc: { title: 'new' }, savedAt: '2026-05-04T08:00:00Z' }));
    expect(readLocalDraft(storage, 7)).toMatchObject({ baseRevision: 3, doc: { title: 'new' } });
    expect(writes).toEqual([`remove ${draftKey(7, 2)}`, `put ${draftKey(7, 3)}`]);
    expect(storage.length).toBe(2);
  });
});
