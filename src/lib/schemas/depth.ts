/** Nesting limits for documents: measured and cut without recursion. */

/**
 * How deeply objects and lists may nest anywhere in a document. The format's own fields go four
 * levels deep (document → nodes → node → position); fields of other tools are kept, but only
 * this deep, so no stored document can exhaust the stack of whatever reads it later.
 */
export const MAX_DEPTH = 16;

const isContainer = (value: unknown): value is Record<string, unknown> | unknown[] => typeof value === 'object' && value !== null;

/**
 * The first place where the document nests deeper than MAX_DEPTH, or null. Iterative (an explicit
 * stack), so a document nested thousands of levels deep is measured, not recursed into.
 */
export function findDepthIssue(input: unknown): { path: (string | number)[]; message: string } | null {
  if (!isContainer(input)) return null;
  const stack: { value: Record<string, unknown> | unknown[]; path: (string | number)[] }[] = [{ value: input, path: [] }];
  while (stack.length) {
    const { value, path } = stack.pop()!;
    if (path.length >= MAX_DEPTH) return { path, message: `nests deeper than ${MAX_DEPTH} levels; keep extra fields flatter` };
    const entries: [string | number, unknown][] = Array.isArray(value) ? value.map((v, i) => [i, v]) : Object.entries(value);
    for (const [key, child] of entries) if (isContainer(child)) stack.push({ value: child, path: [...path, key] });
  }
  return null;
}

/**
 * Cuts anything nested deeper than MAX_DEPTH out of a value (in place), leaving a short marker:
 * documents stored before the limit existed still open and render.
 */
export function pruneDeep<T>(input: T): T {
  if (!isContainer(input)) return input;
  const stack: { value: Record<string, unknown> | unknown[]; depth: number }[] = [{ value: input, depth: 1 }];
  while (stack.length) {
    const { value, depth } = stack.pop()!;
    const record = value as Record<string | number, unknown>;
    for (const key of Object.keys(value)) {
      const child = record[key];
      if (!isContainer(child)) continue;
      if (depth >= MAX_DEPTH) record[key] = '(removed: nested too deep)';
      else stack.push({ value: child, depth: depth + 1 });
    }
  }
  return input;
}
