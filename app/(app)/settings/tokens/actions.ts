'use server';

import { revalidatePath } from 'next/cache';
import { headers } from 'next/headers';
import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/session';
import { formValues, runAction, type ActionState } from '@/lib/http/action';
import { createToken } from '@/lib/tokens/create-token';
import { revokeToken } from '@/lib/tokens/revoke-token';
import { clientAddress } from '@/lib/http/client-address';
import type { CreatedTokenData } from '@/components/tokens/create-token-form';

async function signedIn() {
  const user = await currentUser();
  if (!user) redirect('/sign-in?callbackUrl=%2Fsettings%2Ftokens');
  return { id: user.id, via: 'session' as const };
}

async function clientIp(): Promise<string | null> {
  return clientAddress(await headers());
}

/** "Create token": the secret goes back to this form only; the list below re-renders without it. */
export async function createTokenAction(_prev: ActionState<CreatedTokenData>, form: FormData): Promise<ActionState<CreatedTokenData>> {
  const actor = await signedIn();
  const scopes = form.getAll('scopes').filter((s): s is string => typeof s === 'string');
  const values: Record<string, string> = { ...formValues(form, ['name', 'expiry']), scopes: scopes.join(',') };
  const expiry = values.expiry === 'never' ? null : Number(values.expiry);
  const result = await runAction(async () => {
    const created = await createToken(actor, { name: values.name, scopes, expiresInDays: expiry }, { ip: await clientIp() });
    return { name: created.name, token: created.token };
  }, values);
  revalidatePath('/settings/tokens');
  return result;
}

export async function revokeTokenAction(_prev: ActionState<unknown>, form: FormData): Promise<ActionState<unknown>> {
  const actor = await signedIn();
  const tokenId = String(form.get('tokenId') ?? '');
  const result = await runAction(async () => {
    await revokeToken(actor, tokenId, { ip: await clientIp() });
  });
  revalidatePath('/settings/tokens');
  return result;
}
