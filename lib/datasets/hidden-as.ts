import { AppError } from '@/lib/errors';

/**
 * For a file or link looked up through its version: a 404 from the version check is re-worded as the caller's own
 * not-found message, so another group's id reads exactly like an unknown one (no existence oracle). Other refusals pass.
 */
export function hiddenAs(message: string): (error: unknown) => never {
  return (error) => {
    if ((error as { status?: unknown } | null)?.status === 404) throw new AppError('not_found', message);
    throw error;
  };
}
