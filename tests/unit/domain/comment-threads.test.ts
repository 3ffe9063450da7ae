import { describe, expect, it } from 'vitest';
import { commentThreads, openPins } from '@/lib/domain/comment-threads';

const c = (id: number, replyTo: number | null, elementId: string | null = null, resolved = false) => ({ id, replyTo, elementId, resolvedAt: resolved ? new Date(0) : null });

describe('comment threads', () => {
  it('numbers only the comments that start a thread and puts replies under theirs, in order', () => {
    const threads = commentThreads([c(1, null, 'A'), c(2, null), c(3, 1), c(4, null, 'B'), c(5, 1), c(6, 4)]);
    expect(threads.map((t) => [t.number, t.comment.id, t.replies.map((r) => r.id)])).toEqual([[1, 1, [3, 5]], [2, 2, []], [3, 4, [6]]]);
  });

  it('never loses a reply whose comment is not in the list: it stands as a thread', () => {
    expect(commentThreads([c(7, 99)]).map((t) => [t.number, t.comment.id])).toEqual([[1, 7]]);
  });

  it('pins open threads by their number; replies and resolved ones put no marker', () => {
    const threads = commentThreads([c(1, null, 'A'), c(2, 1), c(3, null, 'A', true), c(4, null, 'A'), c(5, null, 'B')]);
    expect(openPins(threads)).toEqual({ A: [1, 3], B: [4] });
  });
});
