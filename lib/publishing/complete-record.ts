import { AppError } from '@/lib/errors';
import { plural } from '@/lib/format/plural';
import { validateTransportDataset, type TransportDataset } from '@/lib/schema';

/**
 * The version's record when it passes the full schema; otherwise 422 naming every field to fix
 * (details.fieldErrors: path → message, details.errors: the FieldError list).
 */
export function requireCompleteRecord(metadata: unknown, doing: string): TransportDataset {
  const outcome = validateTransportDataset(metadata);
  if (outcome.ok) return outcome.value;
  const fieldErrors = Object.fromEntries(outcome.errors.map((e) => [e.path || '(record)', e.message]));
  const paths = Object.keys(fieldErrors);
  const listed = paths.slice(0, 8).join(', ') + (paths.length > 8 ? ', …' : '');
  throw new AppError(
    'validation_failed',
    `This version cannot be ${doing} until ${plural(paths.length, 'field')} ${paths.length === 1 ? 'is' : 'are'} fixed: ${listed}.`,
    { fieldErrors, errors: outcome.errors },
  );
}
