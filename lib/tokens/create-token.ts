import 'server-only';
import { randomUUID } from 'node:crypto';
import schema from '@/schemas/api/create-api-token.schema.json';
import { recordAudit } from '@/lib/audit/record-audit';
import { AppError } from '@/lib/errors';
import { validateWith } from '@/lib/validation/validate';
import { countUsableTokens, findTokenRow, insertToken } from './repo';
import { TOKEN_SCOPES, type TokenScope } from './scopes';
import { generateTokenSecret } from './token-secret';
import { toTokenView, type TokenView } from './token-view';

export type CreateTokenInput = { name: string; scopes: TokenScope[]; expiresInDays?: number | null };
/** Who asks: only a browser session may mint tokens, so a leaked token cannot make more of itself. */
export type TokenActor = { id: string; via?: 'session' | 'token' };
/** The new token; `token` is the secret, returned this once and never stored. */
export type CreatedToken = TokenView & { token: string };

export const MAX_EXPIRY_DAYS = 365;
export const MAX_USABLE_TOKENS = 50;
const DAY_MS = 24 * 60 * 60 * 1000;

export function parseCreateTokenBody(body: unknown): CreateTokenInput {
  const parsed = validateWith<CreateTokenInput>(schema, body);
  if (!parsed.ok) throw new AppError('validation_failed', 'Please correct the highlighted fields.', { fieldErrors: parsed.fieldErrors });
  return parsed.value;
}

export async function createToken(actor: TokenActor, body: unknown, opts: { ip?: string | null; now?: Date } = {}): Promise<CreatedToken> {
  if (actor.via === 'token') throw new AppError('forbidden', 'API tokens cannot create tokens; sign in to Ohmstead in a browser to make one.');
  const input = parseCreateTokenBody(body);
  const now = opts.now ?? new Date();
  if ((await countUsableTokens(actor.id, now)) >= MAX_USABLE_TOKENS) {
    throw new AppError('conflict', `You already have ${MAX_USABLE_TOKENS} working tokens; revoke some you no longer use first.`);
  }
  const scopes = TOKEN_SCOPES.filter((s) => input.scopes.includes(s));
  const expiresAt = input.expiresInDays ? new Date(now.getTime() + input.expiresInDays * DAY_MS) : null;
  const secret = generateTokenSecret();
  const id = randomUUID();
  await insertToken({
    id, userId: actor.id, name: input.name.trim(), tokenPrefix: secret.displayPrefix, tokenHash: secret.tokenHash, scopes, expiresAt, createdAt: now,
  });
  await recordAudit({
    action: 'token.created', actorKind: 'user', actorUserId: actor.id, targetType: 'api_token', targetId: id, ip: opts.ip,
    details: { name: input.name.trim(), scopes, expiresAt: expiresAt?.toISOString() ?? null },
  });
  const row = await findTokenRow(actor.id, id);
  if (!row) throw new Error('token vanished after insert');
  return { ...toTokenView(row, now), token: secret.token };
}
