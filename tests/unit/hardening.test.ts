/** The pure parts of the hardening: password strength, nesting limits, mailboxes, cookie policy, the workflow table, mail clipping. */
import { describe, expect, it } from 'vitest';
import { mailboxKey } from '@/lib/domain/people';
import { nextStatus, PLAN_STATUSES, WORKFLOW_ACTIONS } from '@/lib/domain/plan-status';
import { findDepthIssue, MAX_DEPTH, pruneDeep } from '@/lib/schemas/depth';
import { idParam } from '@/lib/schemas/api';
import { newPassword } from '@/lib/schemas/password';
import { cookieIsSecure } from '@/lib/server/auth';
import { clip, decidedMessage, MAIL_COMMENTS } from '@/lib/server/mail-messages';

describe('new passwords', () => {
  it.each([' '.repeat(10), '\u0000'.repeat(10), 'aaaaaaaaaa', 'password12', '1234567890', 'qwertyuiop', 'abcdefghij'])('refuses %j', (weak) => {
    expect(newPassword.safeParse(weak).success).toBe(false);
  });

  it('counts characters as code points, not UTF-16 units', () => {
    const result = newPassword.safeParse('🔥'.repeat(9));
    expect(result.success).toBe(false);
    expect(result.error!.issues[0].message).toBe('must be at least 10 characters');
  });

  it('accepts a few unrelated words', () => {
    expect(newPassword.safeParse('violet ladder across the creek').success).toBe(true);
  });

  it('says why a password is weak', () => {
    expect(newPassword.safeParse('aaaaaaaaaa').error!.issues[0].message).toMatch(/too easy to guess \(it repeats one character\)/);
  });
});

describe('nesting limits', () => {
  const nested = (depth: number) => {
    let value: unknown = 1;
    for (let i = 0; i < depth; i += 1) value = [value];
    return value;
  };

  it('finds the first place nested too deep, without recursion, even 100,000 levels down', () => {
    expect(findDepthIssue({ a: nested(MAX_DEPTH - 1) })).toBeNull();
    const issue = findDepthIssue({ a: nested(100_000) });
    expect(issue!.path).toEqual(['a', ...Array(MAX_DEPTH - 1).fill(0)]);
  });

  it('cuts a stored value to the limit and keeps the rest', () => {
    const value = { keep: { x: 1 }, deep: nested(50_000) } as Record<string, unknown>;
    pruneDeep(value);
    expect(value.keep).toEqual({ x: 1 });
    expect(findDepthIssue(value)).toBeNull();
    expect(JSON.stringify(value)).toContain('(removed: nested too deep)');
  });
});

describe('numbers in addresses', () => {
  it.each(['1', '42', 7])('reads %j', (value) => expect(idParam.safeParse(value).success).toBe(true));
  it.each(['0x1', '%31', '1 ', ' 1', '1e0', '01', '0', '-1', '1.5', '', null, 1.5, '99999999999'])('refuses %j', (value) => expect(idParam.safeParse(value).success).toBe(false));
});

describe('mailboxes', () => {
  it('are the same across case and +tags', () => {
    expect(mailboxKey('Lead+Review@Example.Test')).toBe('lead@example.test');
    expect(mailboxKey('lead@example.test')).toBe(mailboxKey('LEAD+x+y@example.test'));
    expect(mailboxKey('lead@example.test')).not.toBe(mailboxKey('lead@other.test'));
  });
});

describe('the session cookie', () => {
  it('is Secure exactly when the public address is https', () => {
    expect(cookieIsSecure('https://bondmap.example.test', new URL('http://10.0.0.5:4321/'))).toBe(true);
    expect(cookieIsSecure('http://127.0.0.1:4321', new URL('https://127.0.0.1:4321/'))).toBe(false);
    expect(cookieIsSecure(undefined, new URL('https://bondmap.example.test/'))).toBe(true);
    expect(cookieIsSecure(undefined, new URL('http://127.0.0.1:4321/'))).toBe(false);
  });
});

describe('the workflow table', () => {
  it('gives every state a way out and makes every state reachable', () => {
    for (const status of PLAN_STATUSES) expect(WORKFLOW_ACTIONS.some((a) => nextStatus(status, a))).toBe(true);
    const reached = new Set(['draft']);
    for (let round = 0; round < PLAN_STATUSES.length; round += 1) {
      for (const status of [...reached]) for (const action of WORKFLOW_ACTIONS) { const next = nextStatus(status as never, action); if (next) reached.add(next); }
    }
    expect([...reached].sort()).toEqual([...PLAN_STATUSES].sort());
  });
});

describe('mail bodies', () => {
  it('clip at code points and list a bounded number of comments', () => {
    expect(clip('🔥🔥🔥', 2)).toBe('🔥🔥…');
    const comments = Array.from({ length: MAIL_COMMENTS + 5 }, (_, i) => `${i} ${'"'.repeat(5000)}`);
    const mail = decidedMessage('lead@example.test', { id: 1, title: 'T', revision: 1, organizationId: 1 }, 'return', 'R', comments, 'http://app.test');
    expect(mail.text).toContain('…and 5 more on the plan page.');
    expect(Buffer.byteLength(mail.html)).toBeLessThan(16 * 1024 * 1024);
    expect(Buffer.byteLength(mail.html)).toBeLessThan(MAIL_COMMENTS * 1100 * 5 + 10_000);
  });
});
