/**
 * Is a grounding set fit to go on? The record asks through this seam so the organisation's
 * inventory can answer when it exists. Synchronous on purpose: the server and the device both
 * build a lookup from data they hold (the inventory rows, or a cached copy offline).
 */
export type SetStatus = { usable: true } | { usable: false; reason: 'out-of-service' | 'overdue' | 'unknown'; detail?: string };

export interface SetStatusLookup {
  statusOf(setTag: string): SetStatus;
}

/** Until the inventory lands, a set tag is free text and every tag is accepted. */
export const freeTextSetStatus: SetStatusLookup = {
  statusOf: () => ({ usable: true }),
};

/** A lookup over a fixed table of tag → status (tests, and the device's cached inventory). */
export function tableSetStatus(table: Record<string, SetStatus>, otherwise: SetStatus = { usable: true }): SetStatusLookup {
  return { statusOf: (tag) => table[tag] ?? otherwise };
}

/** What the record needs of one set in the organisation's inventory (a copy may travel to the device). */
export interface InventorySet {
  tag: string;
  status: 'in-service' | 'out-of-service' | 'retired';
  testDueOn: string;
  statusReason?: string | null;
}

/** One set's fitness on `today` (YYYY-MM-DD): in service and not past its test due date. */
export function inventoryStatusOf(set: InventorySet | undefined, tag: string, today: string): SetStatus {
  if (!set) return { usable: false, reason: 'unknown', detail: `${tag} is not in your organisation's inventory` };
  if (set.status !== 'in-service') {
    const state = set.status === 'retired' ? 'retired' : 'out of service';
    return { usable: false, reason: 'out-of-service', detail: `${set.tag} is ${state}${set.statusReason ? `: ${set.statusReason}` : ''}` };
  }
  // Due dates are whole days written YYYY-MM-DD, so comparing the text compares the dates.
  if (set.testDueOn < today) return { usable: false, reason: 'overdue', detail: `${set.tag} was due for its test on ${set.testDueOn}` };
  return { usable: true };
}

/**
 * A lookup over the organisation's sets on `today`. Tags match without regard to case (the
 * inventory keeps them unique that way). The server builds it from the inventory rows; the device
 * builds the same one from the copy sent with the record, so both answer alike.
 */
export function inventorySetStatus(sets: readonly InventorySet[], today: string): SetStatusLookup {
  const byTag = new Map(sets.map((s) => [s.tag.toLowerCase(), s]));
  return { statusOf: (tag) => inventoryStatusOf(byTag.get(tag.trim().toLowerCase()), tag, today) };
}

/** The sets a crew may pick on `today`: those the lookup would accept, in tag order. */
export function usableSets<T extends InventorySet>(sets: readonly T[], today: string): T[] {
  return sets.filter((s) => inventoryStatusOf(s, s.tag, today).usable).sort((a, b) => a.tag.localeCompare(b.tag, undefined, { numeric: true }));
}
