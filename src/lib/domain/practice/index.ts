/** Practice exercises, pure: build, propose, grade. */
export * from './types';
export { applyModifications, buildExercise, neutralLinkIds, plantedFindings, answerElements, classifyGap } from './modify';
export type { BuiltExercise, BuildResult, ModificationIssue } from './modify';
export { proposeRemovals } from './propose';
export type { Proposal } from './propose';
export { bodyCurrentQuestion, cableRatingQuestion, roundFigure } from './numbers';
export { gradeFind, gradeFix, gradeNumbers, fixIntegrity } from './grade';
export type { FindGrade, FixGrade, NumbersGrade } from './grade';
export { nextExercises, progressByGap, progressRows, sortProgressRows, PROGRESS_SORTS } from './progress';
export type { GapProgress, ProgressRow, ProgressSort } from './progress';
export { prepareExercise } from './prepare';
export type { PrepareResult } from './prepare';
