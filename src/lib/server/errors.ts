/**
 * The one catalogue of errors the app answers with. Codes are permanent (clients and tests key on
 * them); each message says what happened, why, and what to do.
 */
import { REFUSALS } from '@/lib/domain/field-record/refusals';
export const ERRORS = {
  AUTH_REQUIRED: { status: 401, message: 'You are not signed in. Sign in and try again.' },
  AUTH_INVALID: { status: 401, message: 'That e-mail and password do not match an active account. Check both and try again.' },
  AUTH_THROTTLED: { status: 429, message: 'Too many failed sign-ins for this e-mail. Wait until the time given, or ask your admin to reset your password.' },
  ROLE_REQUIRED: { status: 403, message: 'Your role does not allow this.' },
  ORIGIN_REJECTED: { status: 403, message: 'This request came from another site, so it was refused. Use Bondmap from its own address.' },
  NOT_FOUND: { status: 404, message: 'Nothing here: it does not exist, or it belongs to another organisation.' },
  VALIDATION: { status: 400, message: 'Some fields are not valid; nothing was saved. Fix the fields listed and send again.' },
  NOT_JSON: { status: 400, message: 'The request body is not valid JSON; nothing was saved. Send a JSON document.' },
  UNSUPPORTED_MEDIA: { status: 415, message: 'Send the body as JSON (Content-Type: application/json).' },
  BODY_TOO_LARGE: { status: 413, message: 'The request body is too large; nothing was saved.' },
  STALE_REVISION: { status: 409, message: 'Someone saved this plan after you opened it; nothing of yours was overwritten. Reload theirs, or keep yours as a new revision.' },
  NOT_EDITABLE: { status: 409, message: 'This plan is not a draft, so its document cannot change. Start a new revision to edit it.' },
  SUBMIT_BLOCKED: { status: 409, message: 'This plan still has blockers, so it cannot be submitted. Fix the blockers listed, then submit again.' },
  NOT_SUBMITTABLE: { status: 409, message: 'Only a draft or a returned plan can be submitted; this one is not.' },
  NOT_SUBMITTED: { status: 409, message: 'This plan is not waiting for review, so there is nothing to decide. It may have been decided already; reload it.' },
  ALREADY_DECIDED: { status: 409, message: 'Another reviewer decided this revision a moment ago; yours was not recorded. Reload to see their decision.' },
  OWN_PLAN: { status: 403, message: 'You wrote or edited this plan, so someone else must review it.' },
  NOT_APPROVED: { status: 409, message: 'Only an approved plan can be reopened as a new revision.' },
  TOKEN_INVALID: { status: 400, message: 'This link is not valid any more (used or expired). Ask your admin for a new one.' },
  EMAIL_TAKEN: { status: 409, message: 'Someone already has this e-mail address. Use another, or find that person in the list.' },
  SELF_CHANGE: { status: 409, message: 'You cannot disable yourself or take away your own admin role; ask another admin.' },
  RELATED_REVIEWER: { status: 403, message: 'You were invited by (or through) the author or an editor of this plan, or share a mailbox with one, so someone else must approve it.' },
  SET_TAG_TAKEN: { status: 409, message: 'The organisation already has a grounding set with this tag; nothing was saved. Use another tag, or edit that set.' },
  SET_NEEDS_TEST: { status: 409, message: 'This set is out of service until it passes an in-service test; record a passing test to put it back in service.' },
  // Field records: the rules' refusals keep the domain's codes and words (src/lib/domain/field-record).
  RECORD_PLAN_NOT_APPROVED: { status: 409, message: 'A field record can only be opened on an approved plan. Get this plan approved first.' },
  RECORD_CLOSED: { status: 409, message: REFUSALS.RECORD_CLOSED },
  VOLTAGE_TEST_REQUIRED: { status: 409, message: REFUSALS.VOLTAGE_TEST_REQUIRED },
  VOLTAGE_PRESENT: { status: 409, message: REFUSALS.VOLTAGE_PRESENT },
  LINK_NOT_IN_PLAN: { status: 409, message: REFUSALS.LINK_NOT_IN_PLAN },
  SET_ALREADY_ON: { status: 409, message: REFUSALS.SET_ALREADY_ON },
  SET_TAG_IN_USE: { status: 409, message: REFUSALS.SET_TAG_IN_USE },
  SET_NOT_USABLE: { status: 409, message: REFUSALS.SET_NOT_USABLE },
  SET_NOT_ON: { status: 409, message: REFUSALS.SET_NOT_ON },
  PHASE_NOT_IN_PLAN: { status: 409, message: REFUSALS.PHASE_NOT_IN_PLAN },
  NOT_SIGNED_ON: { status: 409, message: REFUSALS.NOT_SIGNED_ON },
  SETS_STILL_ON: { status: 409, message: REFUSALS.SETS_STILL_ON },
  CLIENT_ID_REUSED: { status: 409, message: 'This clientId was already used for a different entry; nothing was recorded. Make a new UUID for each entry.' },
  PHOTO_TYPE: { status: 415, message: 'That file is not a JPEG, PNG or WebP photo (judged by its content, not its name); nothing was stored.' },
  PHOTO_TOO_LARGE: { status: 413, message: 'That photo is larger than 15 MB; nothing was stored. Send a smaller one.' },
  PHOTO_UNREADABLE: { status: 400, message: 'That photo could not be read as an image; nothing was stored.' },
  PHOTO_STORE_DOWN: { status: 503, message: 'The photo store cannot be reached just now; nothing was stored. Try again in a moment.' },
  DB_DOWN: { status: 503, message: 'The database cannot be reached just now; nothing was changed. Try again in a moment.' },
  TOO_MANY_ATTEMPTS: { status: 429, message: 'Too many attempts from your address or for this e-mail. Wait the time given (Retry-After), then try again.' },
  CHECK_TIMEOUT: { status: 422, message: 'The check of this plan took longer than its time budget and was stopped; nothing was saved. Split the plan into smaller ones.' },
  CHECK_BUSY: { status: 503, message: 'The checker is busy with other plans just now; nothing was saved. Try again in a moment.' },
  INTERNAL: { status: 500, message: 'Something went wrong on our side; nothing was changed. Try again, and tell your admin if it keeps happening.' },
  EXERCISE_NO_GAP: { status: 409, message: 'The modified plan has no blocker the approved one lacks, so there is nothing to find: an exercise must have a gap. Remove or change another link.' },
  REVISION_NOT_APPROVED: { status: 409, message: 'Exercises are made from approved revisions only, and this one is not approved. Pick a plan from the library.' },
  NOT_WITHDRAWABLE: { status: 409, message: 'Only a plan waiting for review can be withdrawn; this one is not (it may have been decided a moment ago). Reload it.' },
  NOT_AUTHOR: { status: 403, message: 'Only the author of this plan (or an admin) can withdraw it.' },
} as const satisfies Record<string, { status: number; message: string }>;

export type ErrorCode = keyof typeof ERRORS;

export interface ErrorIssue {
  path: string;
  message: string;
}

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly status: number;
  readonly issues?: ErrorIssue[];
  readonly extra?: Record<string, unknown>;
  readonly headers?: Record<string, string>;

  constructor(
    code: ErrorCode,
    options: { message?: string; issues?: ErrorIssue[]; extra?: Record<string, unknown>; headers?: Record<string, string> } = {},
  ) {
    super(options.message ?? ERRORS[code].message);
    this.code = code;
    this.status = ERRORS[code].status;
    this.issues = options.issues;
    this.extra = options.extra;
    this.headers = options.headers;
  }

  toBody(): { error: Record<string, unknown> } {
    return {
      error: {
        code: this.code,
        message: this.message,
        ...(this.issues ? { issues: this.issues } : {}),
        ...this.extra,
      },
    };
  }
}

/** True for errors that mean the database is unreachable (not a bad query). */
export function isDbUnavailable(error: unknown): boolean {
  if (!error || typeof error !== 'object') return false;
  const name = (error as { name?: string }).name ?? '';
  if (/^Sequelize(Connection|ConnectionRefused|ConnectionTimedOut|HostNotFound|HostNotReachable|AccessDenied|ConnectionAcquireTimeout|InvalidConnection)Error$/.test(name)) {
    return true;
  }
  const code = (error as { code?: string; parent?: { code?: string } }).parent?.code ?? (error as { code?: string }).code;
  return ['ECONNREFUSED', 'ER_GET_CONNECTION_TIMEOUT', 'ER_CONNECTION_TIMEOUT', 'ER_SOCKET_UNEXPECTED_CLOSE', 'ECONNRESET', 'PROTOCOL_CONNECTION_LOST', 'ER_CONNECTION_ALREADY_CLOSED'].includes(code ?? '');
}
