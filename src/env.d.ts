// eslint-disable-next-line @typescript-eslint/triple-slash-reference -- Astro's own generated types are referenced this way
/// <reference path="../.astro/types.d.ts" />

declare namespace App {
  interface Locals {
    /** The signed-in person, or null when signed out (set by src/middleware.ts). */
    person: import('./lib/domain/people').Person | null;
    /** Id of the current session, so sign-out can end exactly this one. */
    sessionId: string | null;
  }
}
