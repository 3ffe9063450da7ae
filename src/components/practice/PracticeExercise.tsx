/**
 * The practice island (client:only="react" on /practice/[id]): find, fix or numbers, then the
 * graded result from POST /api/exercises/:id/attempts. Retries start from the exercise again.
 */
import { useState } from 'react';
import type { PlanDocument } from '@/lib/schemas/plan';
import { AttemptResultView } from './AttemptResultView';
import { FixCopy } from './FixCopy';
import { MarkElements } from './MarkElements';
import { ReadOnlyDrawing } from './PracticeCanvas';
import type { AttemptResult, LearnerExercise } from './types';

export default function PracticeExercise({ exercise, canAnswer }: { exercise: LearnerExercise; canAnswer: boolean }) {
  const [result, setResult] = useState<AttemptResult | null>(null);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [round, setRound] = useState(0);

  const send = async (answer: { elements: string[] } | { document: PlanDocument } | { choice: number }) => {
    if (!canAnswer) return setProblem('Only apprentices hand in answers; this is a preview.');
    setBusy(true);
    setProblem(null);
    try {
      const response = await fetch(`/api/exercises/${exercise.id}/attempts`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ answer }) });
      const body = await response.json().catch(() => null);
      if (!response.ok) return setProblem(body?.error?.issues?.map((i: { path: string; message: string }) => `${i.path}: ${i.message}`).join('; ') ?? body?.error?.message ?? 'The answer could not be graded; try again.');
      setResult(body as AttemptResult);
    } catch {
      setProblem('The server cannot be reached; your answer was not graded. Try again when the connection is back.');
    } finally {
      setBusy(false);
    }
  };

  if (result) return <AttemptResultView result={result} doc={exercise.document} onRetry={() => { setResult(null); setRound((r) => r + 1); }} />;
  return (
    <div className="space-y-3" key={round} data-testid="practice-exercise" data-ready="true">
      {problem && <p role="alert" className="rounded-md border border-blocker bg-white p-3">{problem}</p>}
      {exercise.kind === 'find' && <MarkElements exercise={exercise} busy={busy} onSubmit={(elements) => void send({ elements })} />}
      {exercise.kind === 'fix' && <FixCopy exercise={exercise} busy={busy} onSubmit={(document) => void send({ document })} />}
      {exercise.kind === 'numbers' && exercise.question && (
        <fieldset className="space-y-3">
          <ReadOnlyDrawing document={exercise.document} />
          <legend className="mb-2 text-lg font-semibold">{exercise.question.text}</legend>
          <div className="grid gap-3 sm:grid-cols-2">
            {exercise.question.choices.map((c, i) => (
              <button key={c} type="button" className="btn min-h-[88px] text-2xl" disabled={busy} onClick={() => void send({ choice: i })}>{c}</button>
            ))}
          </div>
        </fieldset>
      )}
    </div>
  );
}
