import 'server-only';
import { AppError } from '@/lib/errors';
import type { TokenActor } from './create-token';
import { listTokenRows } from './repo';
import { toTokenView, type TokenView } from './token-view';

/** The actor's tokens, newest first, with status; revoked and expired ones stay listed for the record. */
export async function listTokens(actor: TokenActor, now = new Date()): Promise<TokenView[]> {
  if (actor.via === 'token') throw new AppError('forbidden', 'API tokens cannot list tokens; sign in to Ohmstead in a browser.');
  return (await listTokenRows(actor.id)).map((row) => toTokenView(row, now));
}
