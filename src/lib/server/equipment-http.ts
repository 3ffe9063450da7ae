/** Shared by the equipment endpoints: repository outcomes turned into errors. */
import type { WriteOutcome } from '@db/repositories/equipment';
import { AppError } from './errors';

/** The value of a successful write, or the AppError its outcome means. */
export function unwrap<T>(outcome: WriteOutcome<T>): T {
  switch (outcome.kind) {
    case 'ok':
      return outcome.value;
    case 'not-found':
      throw new AppError('NOT_FOUND');
    case 'duplicate-tag':
      throw new AppError('SET_TAG_TAKEN', { issues: [{ path: 'tag', message: `"${outcome.tag}" is already the tag of another set` }], extra: { tag: outcome.tag } });
    case 'needs-test':
      throw new AppError('SET_NEEDS_TEST', { issues: [{ path: 'status', message: 'cannot be in-service until the set passes a test' }] });
    case 'invalid':
      throw new AppError('VALIDATION', { issues: [{ path: outcome.path, message: outcome.message }] });
  }
}
