import 'server-only';
import { recordAudit } from '@/lib/audit/record-audit';
import { AppError } from '@/lib/errors';
import { findTokenRow, markRevoked } from './repo';
import type { TokenActor } from './create-token';
import { toTokenView, type TokenView } from './token-view';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Revokes one of the actor's own tokens; it stops working at once. Revoking twice is harmless (no second audit entry). */
export async function revokeToken(actor: TokenActor, tokenId: string, opts: { ip?: string | null; now?: Date } = {}): Promise<TokenView> {
  if (actor.via === 'token') throw new AppError('forbidden', 'API tokens cannot revoke tokens; sign in to Ohmstead in a browser.');
  // Another user's token answers exactly like a missing one, so ids cannot be probed.
  const missing = new AppError('not_found', 'No such token among yours.');
  if (!UUID.test(tokenId)) throw missing;
  const now = opts.now ?? new Date();
  if (!(await findTokenRow(actor.id, tokenId))) throw missing;
  if (await markRevoked(actor.id, tokenId, now)) {
    await recordAudit({ action: 'token.revoked', actorKind: 'user', actorUserId: actor.id, targetType: 'api_token', targetId: tokenId, ip: opts.ip });
  }
  const row = await findTokenRow(actor.id, tokenId);
  if (!row) throw missing;
  return toTokenView(row, now);
}
