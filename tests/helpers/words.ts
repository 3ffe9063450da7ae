/**
 * Program names in words a person reads: a camelCase or snake_case identifier ("groundOhms",
 * "clamp_ka") is a field name of ours, never a word of the trade or of plain English.
 */
export const PROGRAM_NAME = String.raw`\b(?:[a-z]+(?:[A-Z][a-z0-9]+)+|[a-z]+(?:_[a-z0-9]+)+)\b`;

/** The distinct program names in a text. */
export function programNames(text: string): string[] {
  return [...new Set(text.match(new RegExp(PROGRAM_NAME, 'g')) ?? [])];
}
