/**
 * The one catalogue of errors the app answers with. Codes are permanent (clients and tests key on
 * them); each message says what happened, why, and what to do.
 */
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
  DB_DOWN: { status: 503, message: 'The database cannot be reached just now; nothing was changed. Try again in a moment.' },
  TOO_MANY_ATTEMPTS: { status: 429, message: 'Too many attempts from your address or for this e-mail. Wait the time given (Retry-After), then try again.' },
  CHECK_TIMEOUT: { status: 422, message: 'The check of this plan took longer than its time budget and was stopped; nothing was saved. Split the plan into smaller ones.' },
  CHECK_BUSY: { status: 503, message: 'The checker is busy with other plans just now; nothing was saved. Try again in a moment.' },
  INTERNAL: { status: 500, message: 'Something went wrong on our side; nothing was changed. Try again, and tell your admin if it keeps happening.' },
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
