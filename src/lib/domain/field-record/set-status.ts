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
