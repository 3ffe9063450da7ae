/**
 * Waiting in tests: poll a condition until it holds or a deadline passes, instead of sleeping a
 * fixed time and hoping. The one place a test waits.
 */
import type { Client } from './api';

export interface WaitOptions {
  /** How long to keep asking, in ms (default 10 s). */
  deadline?: number;
  /** Pause between asks, in ms (default 100). */
  every?: number;
  /** Said in the error when the deadline passes. */
  what?: string;
}

/** Resolves with the condition's first truthy value; throws once the deadline has passed. */
export async function waitFor<T>(condition: () => T | Promise<T>, { deadline = 10_000, every = 100, what = 'the condition' }: WaitOptions = {}): Promise<NonNullable<T>> {
  const end = Date.now() + deadline;
  for (;;) {
    const value = await condition();
    if (value) return value as NonNullable<T>;
    if (Date.now() >= end) throw new Error(`waited ${deadline} ms for ${what}`);
    await new Promise((r) => setTimeout(r, every));
  }
}

/** A caught message as `/api/dev/mail` lists it; loose, as the HTTP tests read it. */
export type CaughtMail = { subject: string; text: string; to: string[] } & Record<string, any>;

/** The first caught message to `address` whose subject contains `subjectPart`, as `reader` sees it. */
export function mailTo(reader: Client, address: string, subjectPart: string, deadline = 10_000): Promise<any> {
  return waitFor(
    async () => ((await reader.get(`/api/dev/mail?to=${encodeURIComponent(address)}`)).body.messages as CaughtMail[] | undefined)?.find((m) => m.subject.includes(subjectPart)),
    { deadline, what: `mail to ${address} about "${subjectPart}"` },
  );
}
