/**
 * Making an exercise (island on /practice/new): pick jumpers or bonds to take out and cables to
 * swap, or take one of Bondmap's proposals; choose the kind, write the prompt and note, publish.
 */
import { useState } from 'react';
import type { Finding } from '@/lib/domain/report';
import { CABLE_SIZES } from '@/lib/schemas/plan';

export interface FormLink { id: string; kind: string; cable?: string; name: string }
export interface FormProposal { gap: string; label: string; modifications: { removeLinks: string[]; changeLinks: { id: string; cable: string }[] }; findings: Finding[] }

const PROMPTS = {
  find: 'Something is missing from this plan. Mark every element that is unsafe or outside the work zone.',
  fix: 'This plan has a gap. Fix it on your copy so the check comes back clear.',
  numbers: 'Without the figures tab: pick the right figure for this plan.',
};

export default function ExerciseForm({ planId, revision, links, proposals }: { planId: number; revision: number; links: FormLink[]; proposals: FormProposal[] }) {
  const [remove, setRemove] = useState<string[]>([]);
  const [cables, setCables] = useState<Record<string, string>>({});
  const [kind, setKind] = useState<keyof typeof PROMPTS>('find');
  const [prompt, setPrompt] = useState(PROMPTS.find);
  const [note, setNote] = useState('');
  const [published, setPublished] = useState(true);
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const useProposal = (p: FormProposal) => {
    setRemove(p.modifications.removeLinks);
    setCables(Object.fromEntries(p.modifications.changeLinks.map((c) => [c.id, c.cable])));
  };
  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    setBusy(true);
    setProblem(null);
    const changeLinks = Object.entries(cables).filter(([, c]) => c).map(([id, cable]) => ({ id, cable }));
    try {
      const response = await fetch('/api/exercises', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ planId, revision, kind, removeLinks: remove, changeLinks, prompt, teachingNote: note || undefined, published }) });
      const body = await response.json().catch(() => null);
      if (response.status === 201) return window.location.assign(`/practice/${body.exercise.id}`);
      setProblem([body?.error?.message, ...(body?.error?.issues ?? []).map((i: { path: string; message: string }) => `${i.path}: ${i.message}`)].filter(Boolean).join(' ') || 'The exercise could not be made.');
    } catch {
      setProblem('The server cannot be reached; nothing was made.');
    } finally {
      setBusy(false);
    }
  };

  return (
    <form className="space-y-6" onSubmit={(e) => void submit(e)} data-testid="exercise-form" data-ready="true">
      {proposals.length > 0 && (
        <section className="card space-y-2" aria-label="Proposals">
          <h2>Proposed gaps</h2>
          <p className="text-note">Each was tried on a copy of the plan; the checker finds a blocker of a different kind for each.</p>
          <ul className="space-y-2">
            {proposals.map((p) => (
              <li key={p.gap} className="flex flex-wrap items-start gap-3 border-l-4 border-blocker pl-3">
                <div className="flex-1">
                  <p className="font-semibold">{p.label}: {[...p.modifications.removeLinks.map((id) => `take out ${id}`), ...p.modifications.changeLinks.map((c) => `swap ${c.id} to ${c.cable}`)].join(', ')}</p>
                  <p className="text-sm">{p.findings[0]?.message}{p.findings.length > 1 ? ` (and ${p.findings.length - 1} more blocker${p.findings.length > 2 ? 's' : ''})` : ''}</p>
                </div>
                <button type="button" className="btn" onClick={() => useProposal(p)}>Use this</button>
              </li>
            ))}
          </ul>
        </section>
      )}
      <fieldset className="card space-y-2">
        <legend className="font-semibold">Take out or change</legend>
        <ul className="space-y-1">
          {links.map((l) => (
            <li key={l.id} className="flex flex-wrap items-center gap-3">
              <label className="flex min-h-touch flex-1 items-center gap-2">
                <input type="checkbox" className="h-6 w-6" checked={remove.includes(l.id)} onChange={(e) => setRemove((r) => (e.target.checked ? [...r, l.id] : r.filter((x) => x !== l.id)))} aria-label={`Remove ${l.name}`} />
                {l.name}
              </label>
              {l.kind === 'jumper' && (
                <select className="field w-40" aria-label={`Cable of ${l.name}`} value={cables[l.id] ?? ''} onChange={(e) => setCables((c) => ({ ...c, [l.id]: e.target.value }))}>
                  <option value="">keep {l.cable}</option>
                  {CABLE_SIZES.filter((s) => s !== l.cable).map((s) => <option key={s} value={s}>swap in {s}</option>)}
                </select>
              )}
            </li>
          ))}
        </ul>
      </fieldset>
      <fieldset className="card space-y-2">
        <legend className="font-semibold">Kind</legend>
        <div className="flex flex-wrap gap-3">
          {(['find', 'fix', 'numbers'] as const).map((k) => (
            <label key={k} className="flex min-h-touch items-center gap-2">
              <input type="radio" name="kind" className="h-5 w-5" checked={kind === k} onChange={() => { setKind(k); if (Object.values(PROMPTS).includes(prompt)) setPrompt(PROMPTS[k]); }} />
              {k === 'find' ? 'Find the gap' : k === 'fix' ? 'Fix the gap' : 'Figures (four choices)'}
            </label>
          ))}
        </div>
        <label className="label" htmlFor="prompt">Prompt</label>
        <textarea id="prompt" className="field min-h-[88px] py-2" value={prompt} onChange={(e) => setPrompt(e.target.value)} required maxLength={2000} />
        <label className="label" htmlFor="note">Teaching note (shown with the result)</label>
        <textarea id="note" className="field min-h-[88px] py-2" value={note} onChange={(e) => setNote(e.target.value)} maxLength={4000} />
        <label className="flex min-h-touch items-center gap-2"><input type="checkbox" className="h-6 w-6" checked={published} onChange={(e) => setPublished(e.target.checked)} /> Publish to apprentices now</label>
      </fieldset>
      {problem && <p role="alert" className="rounded-md border border-blocker bg-white p-3">{problem}</p>}
      <button type="submit" className="btn-primary" disabled={busy}>Make the exercise</button>
    </form>
  );
}
