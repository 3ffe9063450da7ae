/** The result of an attempt: score, found / missed / wrong, and each planted gap in the checker's words. */
import type { Finding } from '@/lib/domain/report';
import type { PlanDocument } from '@/lib/schemas/plan';
import { RuleId } from '@/components/ui/RuleId';
import { SeverityMark } from '@/components/ui/SeverityMark';
import { elementName, type AttemptResult } from './types';

function Item({ value, doc }: { value: string | Finding; doc: PlanDocument }) {
  if (typeof value === 'string') return <li>{elementName(doc, value)}</li>;
  return <li>{value.message} <RuleId rule={value.rule} /></li>;
}

function Group({ title, items, doc, testId }: { title: string; items: (string | Finding)[]; doc: PlanDocument; testId: string }) {
  return (
    <section className="card" data-testid={testId}>
      <h3 className="font-semibold">{title} ({items.length})</h3>
      {items.length ? <ul className="list-disc pl-5">{items.map((v, i) => <Item key={i} value={v} doc={doc} />)}</ul> : <p className="text-note">None.</p>}
    </section>
  );
}

export function AttemptResultView({ result, doc, onRetry }: { result: AttemptResult; doc: PlanDocument; onRetry: () => void }) {
  const { explanation } = result;
  return (
    <div className="space-y-4" data-testid="attempt-result">
      <p className="text-2xl font-bold" role="status">
        {result.passed ? <SeverityMark severity="clear">Passed</SeverityMark> : <SeverityMark severity="blocker">Not yet</SeverityMark>} · score <span className="num" data-testid="score">{result.score}</span>
      </p>
      <p className="text-note">Attempts {result.mine.attempts} · best {result.mine.best ?? '–'} · latest {result.mine.latest ?? '–'}</p>
      <div className="grid gap-3 md:grid-cols-3">
        <Group title="Found" items={result.found} doc={doc} testId="found" />
        <Group title="Missed" items={result.missed} doc={doc} testId="missed" />
        <Group title="Wrongly marked or added" items={result.wrong} doc={doc} testId="wrong" />
      </div>
      {explanation.numbers && (
        <section className="card">
          <h3 className="font-semibold">{explanation.numbers.question}</h3>
          <ul className="list-disc pl-5">{explanation.numbers.choices.map((c, i) => <li key={c} className={i === explanation.numbers!.correctIndex ? 'font-semibold' : ''}>{c}: {explanation.numbers!.reasons[i]}</li>)}</ul>
          <p className="text-sm text-note">Basis: {explanation.numbers.basis}</p>
        </section>
      )}
      <section className="card space-y-2" data-testid="explanation">
        <h3 className="font-semibold">The gap, as the checker finds it</h3>
        <ul className="space-y-2">
          {explanation.gaps.map((g, i) => (
            <li key={i} className="border-l-4 border-blocker pl-3">
              <p><SeverityMark severity="blocker" /> <RuleId rule={g.rule} /></p>
              <p>{g.message}</p>
              <p className="text-sm text-note">Basis: {g.basis} · Elements: {g.elements.map((e) => elementName(doc, e)).join(', ')}</p>
            </li>
          ))}
        </ul>
        {explanation.teachingNote && <p><strong>Teaching note.</strong> {explanation.teachingNote}</p>}
        <p><a className="link inline-flex min-h-touch items-center" href={explanation.original.href}>See the approved original: {explanation.original.title}, revision {explanation.original.revision}</a></p>
      </section>
      <button type="button" className="btn" onClick={onRetry}>Try again</button>
    </div>
  );
}
