/** The field record's pure rules: see rules.ts; refusal codes in refusals.ts; the set seam in set-status.ts. */
export * from './types';
export * from './refusals';
export * from './set-status';
export * from './rules';
export * from './judges';
