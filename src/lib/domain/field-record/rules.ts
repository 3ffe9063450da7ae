/**
 * The field record's rules, pure: given the approved plan and the entries so far (in the order
 * they were recorded), what the record says now, whether a new entry is allowed and why not,
 * and which step comes next. No server code, no clock: the same module will run on the device.
 */
import type { PlanDocument } from '@/lib/schemas/plan';
import { refuse, type Refusal } from './refusals';
import type { SetStatusLookup } from './set-status';
import { BRIEFING_ITEMS, type BriefingItem, type EntryBody, type FieldEntry, type Flag, type RecordPlan } from './types';

/** The phases and jumpers of a plan document, as the record uses them. */
export function recordPlanFrom(doc: PlanDocument): RecordPlan {
  const conductors = doc.nodes.filter((n) => n.kind === 'phase').map((n) => ({ id: n.id, letter: 'phase' in n && typeof n.phase === 'string' && n.phase ? n.phase : n.id }));
  // Every phase conductor gets its own result. A letter two conductors share (two circuits on the
  // structure) is named with each conductor's id, as the drawing shows it: "A (A)", "A (A2)".
  const count = new Map<string, number>();
  for (const c of conductors) count.set(c.letter, (count.get(c.letter) ?? 0) + 1);
  const phases = conductors.map((c) => ((count.get(c.letter) ?? 0) > 1 ? `${c.letter} (${c.id})` : c.letter));
  const labels = new Map(doc.nodes.map((n) => [n.id, n.label ?? n.id]));
  const jumpers = doc.links
    .filter((l) => l.kind === 'jumper')
    .map((l) => {
      const planned = 'equipmentId' in l && typeof l.equipmentId === 'string' && l.equipmentId.trim() ? l.equipmentId.trim() : undefined;
      return { id: l.id, label: `${labels.get(l.from) ?? l.from} – ${labels.get(l.to) ?? l.to}`, from: l.from, to: l.to, ...(planned ? { plannedSet: planned } : {}) };
    });
  const grounds = doc.nodes.filter((n) => GROUND_KINDS.has(n.kind) || ('groundOhms' in n && typeof n.groundOhms === 'number'));
  const ground = {
    nodes: grounds.map((n) => n.id),
    phases: conductors.map((c) => c.id),
    bonds: doc.links.filter((l) => l.kind === 'bond').map((l): [string, string] => [l.from, l.to]),
  };
  return { phases: [...new Set(phases)], jumpers, ground };
}

/** Nodes that are a ground in themselves. */
const GROUND_KINDS = new Set(['neutral', 'shield-wire', 'ground-rod', 'earth', 'pole-ground']);

/** The nodes joined to a ground now: through the plan's bonds and the sets on. */
function groundedNow(plan: RecordPlan, on: readonly SetOn[]): Set<string> | null {
  if (!plan.ground) return null;
  const edges: [string, string][] = [...plan.ground.bonds];
  for (const s of on) {
    const j = plan.jumpers.find((x) => x.id === s.link);
    if (j?.from && j.to) edges.push([j.from, j.to]);
  }
  const reached = new Set(plan.ground.nodes);
  for (let grew = true; grew; ) {
    grew = false;
    for (const [a, b] of edges) {
      if (reached.has(a) !== reached.has(b)) {
        reached.add(a);
        reached.add(b);
        grew = true;
      }
    }
  }
  return reached;
}

/**
 * A set for a jumper on a phase goes on only once its other end has a path to ground (the ground
 * end first, for the zone as for each set): true when it may, or when the plan copy cannot say.
 * `grounded` is groundedNow for the sets on, worked out once by the caller.
 */
function groundReady(plan: RecordPlan, grounded: Set<string> | null, link: string): boolean {
  const j = plan.jumpers.find((x) => x.id === link);
  if (!grounded || !plan.ground || !j?.from || !j.to) return true;
  if (!plan.ground.phases.includes(j.from) && !plan.ground.phases.includes(j.to)) return true;
  return grounded.has(j.from) || grounded.has(j.to);
}

export interface SetOn {
  link: string;
  setTag: string;
  at: string;
  by: string;
}

export interface RecordState {
  closed: boolean;
  people: string[];
  visitors: string[];
  briefing: Partial<Record<BriefingItem, { by: string; at: string }>>;
  /** Whether the latest test passed for every phase (and still covers a set going on), and whether any test ever found voltage. */
  testPassed: boolean;
  voltageFound: boolean;
  /** Sets on now, in the order they went on. */
  on: SetOn[];
  /** How many sets went on in all, and how many came off. */
  installed: number;
  removed: number;
  /** Flags raised by each entry, by its position in the list. */
  flags: Flag[][];
}

function emptyState(closed: boolean): RecordState {
  return { closed, people: [], visitors: [], briefing: {}, testPassed: false, voltageFound: false, on: [], installed: 0, removed: 0, flags: [] };
}

/** Whether a voltage test passes: every plan phase absent, detector proved before and after. */
export function testMissing(plan: RecordPlan, body: Extract<EntryBody, { type: 'voltage-test' }>): string[] {
  return plan.phases.filter((p) => body.phases[p] !== 'absent');
}

function testPasses(plan: RecordPlan, body: Extract<EntryBody, { type: 'voltage-test' }>): boolean {
  return body.detectorCheckedBefore && body.detectorCheckedAfter && testMissing(plan, body).length === 0 && !Object.values(body.phases).includes('present');
}

/** The flags an allowed entry raises against the state before it. */
function flagsFor(plan: RecordPlan, state: RecordState, entry: EntryBody): Flag[] {
  const flags: Flag[] = [];
  if (entry.type === 'install') {
    // The plan was checked and approved with its own set's ratings; another set may be fit to go on, but the reviewer should see it.
    const planned = plan.jumpers.find((j) => j.id === entry.link)?.plannedSet;
    if (planned && planned.toLowerCase() !== entry.setTag.trim().toLowerCase()) {
      flags.push({ code: 'set-not-as-planned', message: `Set ${entry.setTag} went on ${entry.link}, where the approved plan names ${planned}: its ratings were checked for ${planned}, not for this set.` });
    }
  }
  if (entry.type === 'remove') {
    const last = state.on[state.on.length - 1];
    if (last && last.link !== entry.link) {
      // Named as the drawing names it (its tag), with its ends and the set on it, so the crew can find it.
      const ends = plan.jumpers.find((j) => j.id === last.link)?.label;
      const which = `${last.link} (${ends ? `${ends}, ` : ''}set ${last.setTag})`;
      flags.push({ code: 'removed-out-of-order', message: `Taken off out of order: ${which} went on last and was expected off first.` });
    }
  }
  if (entry.type === 'install' && !groundReady(plan, groundedNow(plan, state.on), entry.link)) {
    const j = plan.jumpers.find((x) => x.id === entry.link);
    flags.push({ code: 'installed-before-ground', message: `Put on before its other end had a path to ground: ${entry.link}${j ? ` (${j.label})` : ''} went on before the set that grounds it; the ground-side set goes on first.` });
  }
  if (entry.type === 'install' && BRIEFING_ITEMS.some((item) => !state.briefing[item])) {
    flags.push({ code: 'installed-before-briefing', message: 'Put on before every briefing item was ticked.' });
  }
  return flags;
}

export type Verdict = { ok: true; flags: Flag[] } | { ok: false; refusal: Refusal };

/** May this entry be recorded now? Refusals carry a stable code; allowed entries may carry flags. */
export function judgeEntry(plan: RecordPlan, state: RecordState, entry: EntryBody, sets: SetStatusLookup): Verdict {
  const no = (refusal: Refusal): Verdict => ({ ok: false, refusal });
  if (state.closed) return no(refuse('RECORD_CLOSED'));
  switch (entry.type) {
    case 'briefing': {
      const signedOn = state.people.includes(entry.by) || state.visitors.includes(entry.by);
      if (!signedOn) return no(refuse('NOT_SIGNED_ON'));
      break;
    }
    case 'voltage-test': {
      const unknown = Object.keys(entry.phases).filter((p) => !plan.phases.includes(p));
      if (unknown.length) return no(refuse('PHASE_NOT_IN_PLAN', unknown));
      break;
    }
    case 'install': {
      if (!plan.jumpers.some((j) => j.id === entry.link)) return no(refuse('LINK_NOT_IN_PLAN', [entry.link]));
      if (state.voltageFound) return no(refuse('VOLTAGE_PRESENT'));
      if (!state.testPassed) return no(refuse('VOLTAGE_TEST_REQUIRED'));
      if (state.on.some((s) => s.link === entry.link)) return no(refuse('SET_ALREADY_ON', [entry.link]));
      const elsewhere = state.on.find((s) => s.setTag.toLowerCase() === entry.setTag.toLowerCase());
      if (elsewhere) return no(refuse('SET_TAG_IN_USE', [elsewhere.link]));
      const status = sets.statusOf(entry.setTag);
      if (!status.usable) return no({ ...refuse('SET_NOT_USABLE', [entry.setTag]), ...(status.detail ? { message: `${refuse('SET_NOT_USABLE').message} (${status.detail})` } : {}) });
      break;
    }
    case 'remove':
      // Never refused for order: a crew must always be able to take grounds off.
      if (!state.on.some((s) => s.link === entry.link)) return no(refuse('SET_NOT_ON', [entry.link]));
      break;
    default:
      break;
  }
  return { ok: true, flags: flagsFor(plan, state, entry) };
}

/** Applies one allowed entry to the state (a new state; the old one is left alone). */
export function applyEntry(plan: RecordPlan, state: RecordState, entry: FieldEntry, flags: Flag[]): RecordState {
  const next: RecordState = { ...state, briefing: { ...state.briefing }, on: [...state.on], flags: [...state.flags, flags] };
  switch (entry.type) {
    case 'sign-on':
      next.people = [...new Set([...state.people, ...entry.people])];
      next.visitors = [...new Set([...state.visitors, ...entry.visitors])];
      break;
    case 'briefing':
      next.briefing[entry.item] = { by: entry.by, at: entry.at };
      break;
    case 'voltage-test':
      next.testPassed = testPasses(plan, entry);
      next.voltageFound = state.voltageFound || Object.values(entry.phases).includes('present');
      break;
    case 'install':
      next.on.push({ link: entry.link, setTag: entry.setTag, at: entry.at, by: entry.actorId });
      next.installed += 1;
      break;
    case 'remove':
      next.on = next.on.filter((s) => s.link !== entry.link);
      next.removed += 1;
      // A test only covers grounds put on while a ground is in place: with every set off the line
      // is treated as energized again, and the next set needs a new passing test.
      if (next.on.length === 0) next.testPassed = false;
      break;
    default:
      break;
  }
  return next;
}

/** The state after the recorded entries, each judged as it was recorded (flags recomputed). */
export function replay(plan: RecordPlan, entries: readonly FieldEntry[], closed = false): RecordState {
  let state = emptyState(false);
  for (const entry of entries) {
    state = applyEntry(plan, state, entry, flagsFor(plan, state, entry));
  }
  return { ...state, closed };
}

/** Close-out is allowed only when every set that went on has come off. */
export function judgeClose(state: RecordState): { ok: true } | { ok: false; refusal: Refusal } {
  if (state.closed) return { ok: false, refusal: refuse('RECORD_CLOSED') };
  if (state.on.length) return { ok: false, refusal: refuse('SETS_STILL_ON', state.on.map((s) => s.link)) };
  return { ok: true };
}

export type NextStep =
  | { kind: 'sign-on' }
  | { kind: 'briefing'; item: BriefingItem }
  | { kind: 'voltage-test' }
  | { kind: 'install'; link: string }
  | { kind: 'remove'; link: string }
  | { kind: 'close' }
  | { kind: 'stop' }
  | { kind: 'closed' };

/**
 * The step the crew is expected to take next: sign on, the briefing in order, the test, the sets
 * in plan order with the ground side first, then off in reverse order, then close-out. After voltage is found: stop (or take
 * off anything already on).
 */
export function nextStep(plan: RecordPlan, state: RecordState): NextStep {
  if (state.closed) return { kind: 'closed' };
  const last = state.on[state.on.length - 1];
  if (state.voltageFound) return last ? { kind: 'remove', link: last.link } : { kind: 'stop' };
  if (state.people.length + state.visitors.length === 0) return { kind: 'sign-on' };
  const item = BRIEFING_ITEMS.find((i) => !state.briefing[i]);
  if (item) return { kind: 'briefing', item };
  if (!state.testPassed && state.installed === 0) return { kind: 'voltage-test' };
  if (state.testPassed && state.removed === 0) {
    // In plan order, but a set on a phase waits until its other end has a path to ground.
    const pending = plan.jumpers.filter((j) => !state.on.some((s) => s.link === j.id));
    const grounded = groundedNow(plan, state.on);
    const next = pending.find((j) => groundReady(plan, grounded, j.id)) ?? pending[0];
    if (next) return { kind: 'install', link: next.id };
  }
  if (last) return { kind: 'remove', link: last.link };
  return { kind: 'close' };
}
