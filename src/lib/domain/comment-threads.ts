/**
 * Review comments as threads: each comment that starts a thread gets the number people refer to
 * ("comment 2"), its replies sit under it in the order written. Replies have no number of their
 * own and are never pinned or resolved apart from their comment.
 */
export interface Threadable {
  id: number;
  replyTo: number | null;
}

export interface Thread<T extends Threadable> {
  comment: T;
  /** 1, 2, 3… in the order the threads were started. */
  number: number;
  replies: T[];
}

/** Threads in the order given (oldest first); a reply whose comment is missing starts its own thread. */
export function commentThreads<T extends Threadable>(comments: readonly T[]): Thread<T>[] {
  const starts = new Set(comments.filter((c) => c.replyTo === null).map((c) => c.id));
  const threads: Thread<T>[] = [];
  const byId = new Map<number, Thread<T>>();
  for (const c of comments) {
    if (c.replyTo !== null && starts.has(c.replyTo)) continue;
    const thread = { comment: c, number: threads.length + 1, replies: [] };
    threads.push(thread);
    byId.set(c.id, thread);
  }
  for (const c of comments) if (c.replyTo !== null && starts.has(c.replyTo)) byId.get(c.replyTo)!.replies.push(c);
  return threads;
}

/** The drawing's markers: element id → the numbers of the open threads pinned to it. */
export function openPins<T extends Threadable & { elementId: string | null; resolvedAt: Date | null }>(threads: readonly Thread<T>[]): Record<string, number[]> {
  const pins: Record<string, number[]> = {};
  for (const { comment, number } of threads) if (comment.elementId && !comment.resolvedAt) (pins[comment.elementId] ??= []).push(number);
  return pins;
}
