/** Importing a plan JSON file: every problem listed by path, nothing replaced until it parses. */
import { useEffect, useRef } from 'react';
import type { PlanIssue } from '@/lib/schemas/plan';

export function ImportProblems({ fileName, issues, onClose }: { fileName: string; issues: PlanIssue[]; onClose: () => void }) {
  const ref = useRef<HTMLButtonElement>(null);
  useEffect(() => ref.current?.focus(), []);
  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-ink/40 p-4">
      <div role="alertdialog" aria-modal="true" aria-labelledby="import-title" className="card max-h-[80vh] max-w-xl space-y-3 overflow-y-auto shadow-xl" data-testid="import-problems">
        <h2 id="import-title">{fileName} was not imported</h2>
        <p>The file is not a plan this version of Bondmap can read. Nothing on the canvas changed. Problems, by place in the file:</p>
        <ul className="list-disc space-y-1 pl-6">{issues.map((i, n) => <li key={n}><code className="font-semibold">{i.path}</code>: {i.message}</li>)}</ul>
        <button ref={ref} type="button" className="btn" onClick={onClose}>Close</button>
      </div>
    </div>
  );
}
