/**
 * New passwords: length in code points (an emoji is one character, not two UTF-16 units) and a
 * real strength estimate (zxcvbn-ts with its common-password and keyboard-pattern lists), so ten
 * spaces, ten NULs, `aaaaaaaaaa` or `password12` are refused however long they are.
 */
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import { z } from 'zod';

export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 256;
/** zxcvbn's score 3: about 10⁸ guesses or more ("safely unguessable" for an online attack). */
export const PASSWORD_MIN_SCORE = 3;

let estimator: ZxcvbnFactory | null = null;

/** zxcvbn's score (0–4) and, when weak, its warning in words. */
export function passwordStrength(password: string): { score: number; warning: string | null } {
  estimator ??= new ZxcvbnFactory({ dictionary: { ...common.dictionary }, graphs: common.adjacencyGraphs });
  const result = estimator.check(password);
  return { score: result.score, warning: result.feedback.warning };
}

const WARNINGS: Record<string, string> = {
  simpleRepeat: 'repeats one character',
  extendedRepeat: 'repeats a short pattern',
  topTen: 'is one of the most common passwords',
  topHundred: 'is one of the most common passwords',
  common: 'is a commonly used password',
  similarToCommon: 'is too close to a commonly used password',
  sequences: 'is a simple sequence such as abc or 123',
  keyPattern: 'is a keyboard pattern',
  straightRow: 'is a row of keys',
  dates: 'is a date',
  recentYears: 'is a recent year',
};

export const newPassword = z
  .string({ required_error: 'is required', invalid_type_error: 'must be a string' })
  .superRefine((password, ctx) => {
    const length = [...password].length;
    if (length < PASSWORD_MIN) return ctx.addIssue({ code: 'custom', message: `must be at least ${PASSWORD_MIN} characters` });
    if (length > PASSWORD_MAX) return ctx.addIssue({ code: 'custom', message: `must be at most ${PASSWORD_MAX} characters` });
    const { score, warning } = passwordStrength(password);
    if (score < PASSWORD_MIN_SCORE) {
      const why = warning && WARNINGS[warning] ? ` (it ${WARNINGS[warning]})` : '';
      ctx.addIssue({ code: 'custom', message: `is too easy to guess${why}: use a few unrelated words or a longer mix` });
    }
  });
