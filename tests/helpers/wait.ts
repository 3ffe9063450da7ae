/**
 * Waiting in tests: poll a condition until it holds or a deadline passes, instead of sleeping a
 * fixed time and hoping. The one place a test waits.
 */
import type { Client } from './api';
import { programNames } from './words';

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

/**
 * Resolves with `read()`'s value once it has stayed the same (as JSON) for `quiet` ms: an animation
 * has settled, or work that follows an answer has stopped changing what it changes. Throws when
 * it is still changing at the deadline.
 */
export async function waitForSteady<T>(read: () => T | Promise<T>, { quiet = 300, deadline = 10_000, every = 50, what = 'the value to settle' }: WaitOptions & { quiet?: number } = {}): Promise<T> {
  const end = Date.now() + deadline;
  let last = JSON.stringify(await read());
  let since = Date.now();
  for (;;) {
    await new Promise((r) => setTimeout(r, every));
    const value = await read();
    const now = JSON.stringify(value);
    if (now !== last) {
      last = now;
      since = Date.now();
    } else if (Date.now() - since >= quiet) {
      return value;
    }
    if (Date.now() >= end) throw new Error(`waited ${deadline} ms for ${what}; it kept changing`);
  }
}

/** Waits out the `Retry-After` seconds an answer named (the server's own time, not a guess), plus a margin. */
export function waitRetryAfter(seconds: number, marginMs = 100): Promise<void> {
  return new Promise((r) => setTimeout(r, seconds * 1000 + marginMs));
}

/** A caught message as `/api/dev/mail` lists it; loose, as the HTTP tests read it. */
export type CaughtMail = { subject: string; text: string; to: string[] } & Record<string, any>;

/** The first caught message to `address` whose subject contains `subjectPart`, as `reader` sees it. */
export async function mailTo(reader: Client, address: string, subjectPart: string, deadline = 10_000): Promise<any> {
  const mail: CaughtMail = await waitFor(
    async () => ((await reader.get(`/api/dev/mail?to=${encodeURIComponent(address)}`)).body.messages as CaughtMail[] | undefined)?.find((m) => m.subject.includes(subjectPart)),
    { deadline, what: `mail to ${address} about "${subjectPart}"` },
  );
  // Every message a test reads is also read for program names (links and addresses left out: they are not words).
  const names = programNames(`${mail.subject}\n${mail.text}`.replace(/https?:\/\/\S+|\S+@\S+/g, ''));
  if (names.length) throw new Error(`mail "${mail.subject}" to ${address} says program names: ${names.join(', ')}`);
  return mail;
}

/**
 * Sends health requests one after another for as long as `work` runs: on a free event loop each
 * answers at once, while work done on the main thread would hold one of them for its whole length.
 * Every health answer must be 200; returns the work's answer, each health latency and the work's time.
 */
export async function healthWhile<T>(work: Promise<T>, health: () => Promise<{ status: number }>): Promise<{ answer: T; latencies: number[]; tookMs: number }> {
  let done = false;
  const started = performance.now();
  const tracked = work.finally(() => {
    done = true;
  });
  const latencies: number[] = [];
  while (!done) {
    const sent = performance.now();
    const { status } = await health();
    if (status !== 200) throw new Error(`health answered ${status} while the work ran`);
    latencies.push(performance.now() - sent);
  }
  const answer = await tracked;
  return { answer, latencies, tookMs: performance.now() - started };
}
