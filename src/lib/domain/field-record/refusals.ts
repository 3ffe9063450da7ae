/**
 * Every reason the record refuses a step: a permanent code and one message. The server answers
 * 409 with the code; the device (offline, next) shows the same words.
 */
export const REFUSALS = {
  RECORD_CLOSED: 'This field record is closed; nothing can be added or changed.',
  VOLTAGE_TEST_REQUIRED: 'No set can go on before a passing voltage test covers every phase, with the detector proved before and after.',
  VOLTAGE_PRESENT: 'Voltage was found. Stop: no set goes on. Call the system operator.',
  LINK_NOT_IN_PLAN: 'That jumper is not in the approved plan. Record a deviation and ask for a revised plan.',
  SET_ALREADY_ON: 'A set is already on that jumper.',
  SET_TAG_IN_USE: 'That set is already on another jumper.',
  SET_NOT_USABLE: 'That set is out of service or overdue for its test; use another set.',
  SET_NOT_ON: 'No set is on that jumper, so there is nothing to take off.',
  PHASE_NOT_IN_PLAN: 'The test names a phase that is not in the plan.',
  NOT_SIGNED_ON: 'Only someone signed on to this record can tick a briefing item.',
  SETS_STILL_ON: 'Sets are still on; take every set off before closing out.',
} as const;

export type RefusalCode = keyof typeof REFUSALS;

export interface Refusal {
  code: RefusalCode;
  message: string;
  /** Jumpers concerned (for SETS_STILL_ON: those still on; for tests: phases missing). */
  items?: string[];
}

export function refuse(code: RefusalCode, items?: string[]): Refusal {
  return { code, message: REFUSALS[code], ...(items?.length ? { items } : {}) };
}
