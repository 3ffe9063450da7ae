import { describe, expect, it } from 'vitest';
import {
  applyEntry, freeTextSetStatus, judgeClose, judgeEntry, nextStep, recordPlanFrom, replay, tableSetStatus, BRIEFING_ITEMS,
  type EntryBody, type FieldEntry, type RecordPlan, type RecordState, type SetStatusLookup,
} from '@/lib/domain/field-record';
import { planDocument } from '../../helpers/factories';

const plan: RecordPlan = recordPlanFrom(planDocument());
let n = 0;
const entry = (body: EntryBody): FieldEntry => ({ ...body, clientId: `c-${(n += 1)}`, at: `2026-05-04T07:${String(n % 60).padStart(2, '0')}:00Z`, actorId: 'lead' });

/** Records each body in turn, failing the test on any refusal; returns the final state. */
function run(bodies: EntryBody[], sets: SetStatusLookup = freeTextSetStatus): RecordState {
  let state = replay(plan, []);
  for (const body of bodies) {
    const verdict = judgeEntry(plan, state, body, sets);
    if (!verdict.ok) throw new Error(`refused ${body.type}: ${verdict.refusal.code}`);
    state = applyEntry(plan, state, entry(body), verdict.flags);
  }
  return state;
}

const signOn: EntryBody = { type: 'sign-on', people: ['lead'], visitors: ['Visiting Inspector'] };
const briefing: EntryBody[] = BRIEFING_ITEMS.map((item) => ({ type: 'briefing', item, by: 'lead' }));
const passing: EntryBody = { type: 'voltage-test', detector: 'Detector 7', detectorCheckedBefore: true, detectorCheckedAfter: true, phases: { A: 'absent', B: 'absent', C: 'absent' } };
const install = (link: string, setTag = `S-${link}`): EntryBody => ({ type: 'install', link, setTag, groundEndFirst: true });
const remove = (link: string): EntryBody => ({ type: 'remove', link });

describe('the plan as the record sees it', () => {
  it('takes the phases and every jumper, not bonds or reaches', () => {
    expect(plan.phases).toEqual(['A', 'B', 'C']);
    expect(plan.jumpers.map((j) => j.id)).toEqual(['jA', 'jB', 'jC', 'jN']);
  });
});

describe('a plan with two conductors of one phase letter (two circuits)', () => {
  const doc = planDocument({ nodes: [...planDocument().nodes, { id: 'A2', kind: 'phase', phase: 'A' }, { id: 'B2', kind: 'phase', phase: 'B' }] });
  const two = recordPlanFrom(doc);

  it('asks the voltage test for every conductor, naming the repeated letters by their conductor', () => {
    expect(two.phases).toEqual(['A (A)', 'B (B)', 'C', 'A (A2)', 'B (B2)']);
  });

  it('puts no set on after a test that left a conductor of a repeated letter out', () => {
    let state = replay(two, []);
    for (const body of [signOn, ...briefing]) state = applyEntry(two, state, entry(body), []);
    // A, B and C read absent says nothing about the second A and B conductors.
    const byLetter = passing;
    expect(judgeEntry(two, state, byLetter, freeTextSetStatus)).toMatchObject({ ok: false, refusal: { code: 'PHASE_NOT_IN_PLAN' } });
    const tested = applyEntry(two, state, entry(byLetter), []);
    expect(judgeEntry(two, tested, install('jA'), freeTextSetStatus)).toMatchObject({ ok: false, refusal: { code: 'VOLTAGE_TEST_REQUIRED' } });
    const all: EntryBody = { ...passing, phases: Object.fromEntries(two.phases.map((p) => [p, 'absent'])) } as EntryBody;
    state = applyEntry(two, state, entry(all), []);
    expect(judgeEntry(two, state, install('jA'), freeTextSetStatus).ok).toBe(true);
  });
});

describe('installing', () => {
  const ready = () => run([signOn, ...briefing, passing]);

  it('is refused before any voltage test', () => {
    const v = judgeEntry(plan, run([signOn]), install('jA'), freeTextSetStatus);
    expect(v).toMatchObject({ ok: false, refusal: { code: 'VOLTAGE_TEST_REQUIRED' } });
  });

  it('is refused when the test leaves a phase out or the detector was not proved after', () => {
    const partial = run([signOn, { ...passing, phases: { A: 'absent', B: 'absent' } } as EntryBody]);
    expect(judgeEntry(plan, partial, install('jA'), freeTextSetStatus)).toMatchObject({ ok: false, refusal: { code: 'VOLTAGE_TEST_REQUIRED' } });
    const unproved = run([signOn, { ...passing, detectorCheckedAfter: false } as EntryBody]);
    expect(judgeEntry(plan, unproved, install('jA'), freeTextSetStatus)).toMatchObject({ ok: false, refusal: { code: 'VOLTAGE_TEST_REQUIRED' } });
  });

  it('is refused after any present result, even if a later test reads absent', () => {
    const present = { ...passing, phases: { A: 'absent', B: 'present', C: 'absent' } } as EntryBody;
    const state = run([signOn, present, passing]);
    expect(judgeEntry(plan, state, install('jA'), freeTextSetStatus)).toMatchObject({ ok: false, refusal: { code: 'VOLTAGE_PRESENT' } });
    expect(nextStep(plan, state)).toEqual({ kind: 'stop' });
  });

  it('is refused for a jumper not in the plan, a set already on, and a set tag on another jumper', () => {
    const state = run([signOn, ...briefing, passing, install('jA', 'T1')]);
    expect(judgeEntry(plan, state, install('rA'), freeTextSetStatus)).toMatchObject({ ok: false, refusal: { code: 'LINK_NOT_IN_PLAN' } });
    expect(judgeEntry(plan, state, install('jA', 'T9'), freeTextSetStatus)).toMatchObject({ ok: false, refusal: { code: 'SET_ALREADY_ON' } });
    expect(judgeEntry(plan, state, install('jB', 't1'), freeTextSetStatus)).toMatchObject({ ok: false, refusal: { code: 'SET_TAG_IN_USE', items: ['jA'] } });
  });

  it('asks the set lookup, and refuses an overdue or out-of-service set', () => {
    const sets = tableSetStatus({ OLD: { usable: false, reason: 'overdue', detail: 'test due 2026-01-01' } });
    const v = judgeEntry(plan, ready(), install('jA', 'OLD'), sets);
    expect(v).toMatchObject({ ok: false, refusal: { code: 'SET_NOT_USABLE' } });
    expect(!v.ok && v.refusal.message).toContain('test due 2026-01-01');
    expect(judgeEntry(plan, ready(), install('jA', 'NEW'), sets).ok).toBe(true);
  });

  it("flags a set other than the plan's own for the jumper (allowed, noticed), in any case of the tag", () => {
    const base = planDocument();
    const named = recordPlanFrom({ ...base, links: base.links.map((l) => (l.id === 'jA' ? { ...l, equipmentId: 'GS-12' } : l)) });
    expect(named.jumpers[0]).toMatchObject({ id: 'jA', plannedSet: 'GS-12' });
    let state = replay(named, []);
    // The ground-side set first, so the phase sets below are judged on the set they carry alone.
    for (const body of [signOn, ...briefing, passing, install('jN')]) state = applyEntry(named, state, entry(body), []);
    expect(judgeEntry(named, state, install('jA', 'GS-40'), freeTextSetStatus)).toEqual({ ok: true, flags: [expect.objectContaining({ code: 'set-not-as-planned' })] });
    expect(judgeEntry(named, state, install('jA', 'gs-12'), freeTextSetStatus)).toEqual({ ok: true, flags: [] });
    expect(judgeEntry(named, state, install('jB', 'GS-40'), freeTextSetStatus)).toEqual({ ok: true, flags: [] });
  });

  it('needs a new passing test once every set has come off (no ground left in place)', () => {
    // Test before installing any ground, unless a previously installed ground is in place
    // [pub: OSHA 1910.269(n)(5), eTool]. With every set off the line is treated as energized again.
    const allOff = run([signOn, ...briefing, passing, install('jA'), install('jB'), remove('jB'), remove('jA')]);
    expect(judgeEntry(plan, allOff, install('jA'), freeTextSetStatus)).toMatchObject({ ok: false, refusal: { code: 'VOLTAGE_TEST_REQUIRED' } });
    expect(nextStep(plan, allOff)).toEqual({ kind: 'close' });
    const retested = run([signOn, ...briefing, passing, install('jA'), remove('jA'), passing]);
    expect(judgeEntry(plan, retested, install('jA'), freeTextSetStatus).ok).toBe(true);
    // One set still on keeps the zone: another may go on without a new test.
    const oneLeft = run([signOn, ...briefing, passing, install('jA'), install('jB'), remove('jB')]);
    expect(judgeEntry(plan, oneLeft, install('jB', 'S-other'), freeTextSetStatus).ok).toBe(true);
  });

  it('flags a set put on before the briefing was complete (allowed, noticed)', () => {
    const v = judgeEntry(plan, run([signOn, passing]), install('jN'), freeTextSetStatus);
    expect(v).toEqual({ ok: true, flags: [expect.objectContaining({ code: 'installed-before-briefing' })] });
  });
});

describe('the ground side goes on first', () => {
  const tested = () => run([signOn, ...briefing, passing]);

  it('offers the set that grounds the cluster bar before the sets on the phases', () => {
    const steps: string[] = [];
    let state = tested();
    for (let i = 0; i < 4; i += 1) {
      const next = nextStep(plan, state);
      if (next.kind !== 'install') throw new Error(`expected an install, got ${next.kind}`);
      steps.push(next.link);
      state = applyEntry(plan, state, entry(install(next.link)), []);
    }
    expect(steps).toEqual(['jN', 'jA', 'jB', 'jC']);
  });

  it('flags a set on a phase put on while its other end has no path to ground (allowed, noticed)', () => {
    const v = judgeEntry(plan, tested(), install('jA'), freeTextSetStatus);
    expect(v.ok && v.flags.map((f) => f.code)).toEqual(['installed-before-ground']);
    expect(v.ok && v.flags[0].message).toContain('jA (A – CB)');
    const grounded = run([signOn, ...briefing, passing, install('jN')]);
    expect(judgeEntry(plan, grounded, install('jA'), freeTextSetStatus)).toEqual({ ok: true, flags: [] });
  });

  it('counts a permanent bond to ground as a path, and asks nothing of a plan copy without the ground data', () => {
    const bonded = recordPlanFrom(planDocument({ links: [...planDocument().links, { id: 'bCB', kind: 'bond', from: 'CB', to: 'N' }] }));
    let state = replay(bonded, []);
    for (const body of [signOn, ...briefing, passing]) state = applyEntry(bonded, state, entry(body), []);
    expect(judgeEntry(bonded, state, install('jA'), freeTextSetStatus)).toEqual({ ok: true, flags: [] });
    expect(nextStep(bonded, state)).toEqual({ kind: 'install', link: 'jA' });
    const old: RecordPlan = { phases: plan.phases, jumpers: plan.jumpers.map(({ id, label }) => ({ id, label })) };
    let before = replay(old, []);
    for (const body of [signOn, ...briefing, passing]) before = applyEntry(old, before, entry(body), []);
    expect(judgeEntry(old, before, install('jA'), freeTextSetStatus)).toEqual({ ok: true, flags: [] });
  });
});

describe('removing', () => {
  const allOn = () => run([signOn, ...briefing, passing, install('jA'), install('jB'), install('jC'), install('jN')]);

  it('in reverse order raises no flag', () => {
    const state = run([signOn, ...briefing, passing, install('jN'), install('jA'), remove('jA'), remove('jN')]);
    expect(state.flags.flat()).toEqual([]);
    expect(state.on).toEqual([]);
  });

  it('out of order is flagged, never refused', () => {
    const v = judgeEntry(plan, allOn(), remove('jA'), freeTextSetStatus);
    expect(v).toEqual({ ok: true, flags: [expect.objectContaining({ code: 'removed-out-of-order' })] });
  });

  it('the out-of-order flag names the jumper the crew should have taken off by its ends and set', () => {
    const labelled = recordPlanFrom(planDocument({ nodes: planDocument().nodes.map((x) => ({ ...x, label: x.kind === 'phase' ? `Phase ${x.id}` : x.kind === 'cluster-bar' ? 'Cluster bar' : x.id })) }));
    let state = replay(labelled, []);
    for (const body of [signOn, ...briefing, passing, install('jA', 'LV-1'), install('jB', 'LV-2')]) state = applyEntry(labelled, state, entry(body), []);
    const v = judgeEntry(labelled, state, remove('jA'), freeTextSetStatus);
    expect(v.ok && v.flags[0].message).toBe('Taken off out of order: jB (Phase B – Cluster bar, set LV-2) went on last and was expected off first.');
  });

  it('is allowed after voltage was found, so grounds can always come off', () => {
    const state = run([signOn, ...briefing, passing, install('jA'), { ...passing, phases: { A: 'present', B: 'absent', C: 'absent' } } as EntryBody]);
    expect(nextStep(plan, state)).toEqual({ kind: 'remove', link: 'jA' });
    expect(judgeEntry(plan, state, remove('jA'), freeTextSetStatus).ok).toBe(true);
  });

  it('of a jumper with no set on is refused', () => {
    expect(judgeEntry(plan, allOn(), remove('rA'), freeTextSetStatus)).toMatchObject({ ok: false, refusal: { code: 'SET_NOT_ON' } });
  });
});

describe('briefing and test entries', () => {
  it('a briefing item needs someone signed on', () => {
    expect(judgeEntry(plan, run([signOn]), { type: 'briefing', item: 'plan-reviewed', by: 'stranger' }, freeTextSetStatus)).toMatchObject({ ok: false, refusal: { code: 'NOT_SIGNED_ON' } });
    expect(judgeEntry(plan, run([signOn]), { type: 'briefing', item: 'plan-reviewed', by: 'Visiting Inspector' }, freeTextSetStatus).ok).toBe(true);
  });
  it('a test naming a phase that is not in the plan is refused', () => {
    expect(judgeEntry(plan, run([signOn]), { ...passing, phases: { A: 'absent', X: 'absent' } } as EntryBody, freeTextSetStatus)).toMatchObject({ ok: false, refusal: { code: 'PHASE_NOT_IN_PLAN', items: ['X'] } });
  });
});

describe('close-out and the closed record', () => {
  it('is refused listing the sets still on, allowed once all are off', () => {
    const state = run([signOn, ...briefing, passing, install('jA'), install('jB')]);
    expect(judgeClose(state)).toMatchObject({ ok: false, refusal: { code: 'SETS_STILL_ON', items: ['jA', 'jB'] } });
    expect(judgeClose(run([signOn, ...briefing, passing, install('jA'), remove('jA')]))).toEqual({ ok: true });
  });
  it('a closed record refuses every entry and a second close', () => {
    const closed = { ...run([signOn]), closed: true };
    for (const body of [signOn, passing, install('jA'), { type: 'note', text: 'x' } as EntryBody]) {
      expect(judgeEntry(plan, closed, body, freeTextSetStatus)).toMatchObject({ ok: false, refusal: { code: 'RECORD_CLOSED' } });
    }
    expect(judgeClose(closed)).toMatchObject({ ok: false, refusal: { code: 'RECORD_CLOSED' } });
  });
});

describe('the next expected step', () => {
  it('walks sign-on, the briefing, the test, sets on in plan order with the ground side first, off in reverse, close', () => {
    const steps: string[] = [];
    const bodies = [signOn, ...briefing, passing, install('jN'), install('jA'), install('jB'), install('jC'), remove('jC'), remove('jB'), remove('jA'), remove('jN')];
    for (let i = 0; i <= bodies.length; i += 1) {
      const s = nextStep(plan, run(bodies.slice(0, i)));
      steps.push('link' in s ? `${s.kind}:${s.link}` : 'item' in s ? `${s.kind}:${s.item}` : s.kind);
    }
    expect(steps).toEqual([
      'sign-on', ...BRIEFING_ITEMS.map((i) => `briefing:${i}`), 'voltage-test',
      'install:jN', 'install:jA', 'install:jB', 'install:jC', 'remove:jC', 'remove:jB', 'remove:jA', 'remove:jN', 'close', 'close',
    ].slice(0, bodies.length + 1));
  });

  it('replay recomputes the same flags the entries raised when recorded', () => {
    const bodies = [signOn, passing, install('jN'), install('jA'), remove('jN'), remove('jA')];
    const live = run(bodies);
    const replayed = replay(plan, bodies.map(entry));
    expect(replayed.flags).toEqual(live.flags);
    expect(replayed.flags.flat().map((f) => f.code)).toEqual(['installed-before-briefing', 'installed-before-briefing', 'removed-out-of-order']);
    expect([replayed.installed, replayed.removed]).toEqual([2, 2]);
  });
});
