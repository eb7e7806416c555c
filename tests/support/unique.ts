import { randomBytes } from 'node:crypto';

/** A unique, obviously invented e-mail address for one test. */
export function uniqueEmail(prefix = 'tester'): string {
  return `${prefix}-${randomBytes(5).toString('hex')}@tests.ohmstead.example`;
}
