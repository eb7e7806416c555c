'use client';

import { useActionState } from 'react';
import { useFormStatus } from 'react-dom';
import { Button } from '@/components/ui/button';
import type { ActionState } from '@/lib/http/action';

export type RevokeTokenButtonProps = {
  tokenId: string;
  tokenName: string;
  action: (prev: ActionState<unknown>, form: FormData) => Promise<ActionState<unknown>>;
};

function Submit({ tokenName }: { tokenName: string }) {
  const { pending } = useFormStatus();
  return (
    <Button type="submit" variant="secondary" disabled={pending} aria-label={`Revoke token ${tokenName}`}>
      {pending ? 'Revoking…' : 'Revoke'}
    </Button>
  );
}

export function RevokeTokenButton({ tokenId, tokenName, action }: RevokeTokenButtonProps) {
  const [state, formAction] = useActionState<ActionState<unknown>, FormData>(action, null);
  return (
    <form action={formAction} className="flex flex-col items-end gap-1">
      <input type="hidden" name="tokenId" value={tokenId} />
      <Submit tokenName={tokenName} />
      {state && !state.ok && <p role="alert" className="text-sm text-red-700">{state.error}</p>}
    </form>
  );
}
