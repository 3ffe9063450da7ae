/**
 * The field record's vocabulary: entry kinds, briefing items, refusal codes. Pure data, shared by
 * the server and (next) the device, so a refusal reads the same wherever it is decided.
 */
export const ENTRY_TYPES = ['sign-on', 'briefing', 'voltage-test', 'install', 'remove', 'deviation', 'note'] as const;
export type EntryType = (typeof ENTRY_TYPES)[number];

/** Briefing items, in our own words; each is ticked by a named person with the time. */
export const BRIEFING_ITEMS = ['plan-reviewed', 'hazards-discussed', 'sets-inspected', 'contacts-cleaned', 'detector-proved'] as const;
export type BriefingItem = (typeof BRIEFING_ITEMS)[number];
export const BRIEFING_LABELS: Record<BriefingItem, string> = {
  'plan-reviewed': 'Plan gone over with the whole crew',
  'hazards-discussed': 'Hazards and minimum approach distances talked through',
  'sets-inspected': 'Sets looked over: jacket, strands, ferrules, clamps',
  'contacts-cleaned': 'Conductor and clamp contact faces brushed clean (serrated jaws where fitted)',
  'detector-proved': 'Detector proved on a known live source',
};

export type PhaseResult = 'absent' | 'present';

export type EntryBody =
  | { type: 'sign-on'; people: string[]; visitors: string[] }
  | { type: 'briefing'; item: BriefingItem; by: string }
  | { type: 'voltage-test'; detector: string; detectorCheckedBefore: boolean; detectorCheckedAfter: boolean; phases: Record<string, PhaseResult> }
  | { type: 'install'; link: string; setTag: string; groundEndFirst: true }
  | { type: 'remove'; link: string }
  | { type: 'deviation'; text: string }
  | { type: 'note'; text: string };

/** An entry as recorded: its body, the device's id and time, and who recorded it. */
export type FieldEntry = EntryBody & { clientId: string; at: string; actorId: string };

/** What the record needs of the approved plan: its phases and its jumpers. */
export interface RecordPlan {
  /** Phase keys the voltage test must cover, e.g. ["A", "B", "C"]. */
  phases: string[];
  /**
   * Jumpers of the plan, in drawing order: each gets a set on the day (the plan's own set by tag,
   * when it names one; ends absent in copies made before they were sent).
   */
  jumpers: { id: string; label: string; from?: string; to?: string; plannedSet?: string }[];
  /**
   * Where the zone gets its ground, for the order sets go on: the nodes that are a ground in
   * themselves (neutral, shield wire, rod, earth, pole ground, anything with a ground resistance),
   * the phase conductors, and the permanent bonds. Absent in copies made before they were sent.
   */
  ground?: { nodes: string[]; phases: string[]; bonds: [string, string][] };
}

/** A flag is recorded with an entry: something a reader of the record should notice. */
export type FlagCode = 'removed-out-of-order' | 'installed-before-briefing' | 'installed-before-ground' | 'set-not-as-planned';
export interface Flag {
  code: FlagCode;
  message: string;
}
