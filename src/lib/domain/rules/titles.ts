/**
 * A short title a crew reads for each rule id (library, history): the ids stay for code, stored
 * reports and the editor's small labels. tests/unit/domain/rule-titles.test.ts keeps this complete.
 */
export const RULE_TITLES: Readonly<Record<string, string>> = {
  'stand-not-conductive': 'Worker stands on something that does not conduct',
  'surface-outside-zone': 'Surface within reach is outside the zone',
  'phase-ungrounded': 'Phase not grounded',
  'zone-ungrounded': 'Work zone has no ground',
  'pole-ground-relied': 'Relies on the pole ground',
  'cable-below-minimum': 'Cable below the minimum size',
  'cable-underrated': 'Cable too small for the fault',
  'clamp-underrated': 'Clamps too small for the fault',
  'body-current-exceeds': 'Body current above the limit',
  'lead-slack': 'Lead longer than its span',
  'rod-barricade': 'Barricade around a driven rod',
  'default-assumed': 'Value assumed by the check',
  'contact-unsolved': 'Contact current could not be computed',
  'link-on-insulator': 'Lead ends on an insulating part',
  'reach-insulating': 'Worker can touch an insulating part',
  'clearing-outside-range': 'Clearing time outside the body-current range',
  'figure-invalid': 'A figure could not be computed',
  'set-unknown': 'Grounding set not in the inventory',
  'set-not-in-service': 'Grounding set not in service',
  'set-test-overdue': 'Grounding set overdue for its test',
  'set-differs': 'Drawing differs from the grounding set',
  'set-used-twice': 'One grounding set in two places',
  'earth-link': 'Lead drawn to remote earth',
  'bond-not-rated': 'Conductor joined only by a bond',
  'bond-fault-current': 'Bond carries fault current',
  'plan-incomplete': 'Plan incomplete',
  'worker-no-reach': 'Worker has no reach line',
  'boom-uninsulated': 'Boom not insulated',
  'concrete-ground-ignored': 'Footing resistance on concrete not used',
  'rod-out-of-range': 'Rod outside the formula’s range',
  'lead-whip': 'Lead will whip under fault',
  'clamp-live-line': 'Live-line clamp used as a ground',
  'lead-bare-strands': 'Lead with bare strands',
  'supply-side-ungrounded': 'Supply side not grounded',
  'supply-side-single-point': 'Grounds only at the work location',
  'system-data-missing': 'Fault data missing',
  'worker-stands-nowhere': 'Worker has no standing surface',
  'calc-failed': 'Figures could not be computed',
  'no-worker': 'No worker in the plan',
};

/** The title for a rule id; an id from a newer checker still reads as words, never as the id. */
export const ruleTitle = (rule: string): string => {
  const title = RULE_TITLES[rule];
  if (title) return title;
  const words = rule.replace(/-/g, ' ');
  return words.charAt(0).toUpperCase() + words.slice(1);
};
