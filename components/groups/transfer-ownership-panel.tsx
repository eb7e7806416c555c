import Link from 'next/link';
import type { MemberListItem } from '@/lib/groups/get-members-view';
import { ActionForm, SubmitButton, type GroupAction } from './action-form';

export type TransferOwnershipPanelProps = {
  slug: string;
  groupName: string;
  /** Everyone but the viewer. */
  candidates: MemberListItem[];
  /** Step two: the member chosen in step one, and the viewer's role afterwards. */
  chosen: { member: MemberListItem; stepDownTo: 'curator' | 'member' } | null;
  transfer: GroupAction;
};

/** Two steps: choose the new owner (a plain GET form), then confirm with the consequences spelled out. */
export function TransferOwnershipPanel({ slug, groupName, candidates, chosen, transfer }: TransferOwnershipPanelProps) {
  if (candidates.length === 0) {
    return <p className="text-sm text-slate-600">Invite someone first: ownership can only go to a member of the group.</p>;
  }
  if (!chosen) {
    return (
      <form method="get" action={`/groups/${slug}/members`} className="grid grid-cols-[minmax(0,1fr)] gap-4 md:grid-cols-[minmax(0,1fr)_14rem_auto] md:items-end">
        <div className="flex min-w-0 flex-col gap-1">
          <label htmlFor="transfer-to" className="text-sm font-medium text-slate-800">New owner</label>
          <select id="transfer-to" name="transferTo" required className="w-full min-w-0 rounded-md border border-slate-400 bg-white px-3 py-2 text-slate-900 shadow-sm">
            {candidates.map((m) => <option key={m.userId} value={m.userId}>{m.name} ({m.role})</option>)}
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="transfer-step-down" className="text-sm font-medium text-slate-800">Your role afterwards</label>
          <select id="transfer-step-down" name="stepDownTo" defaultValue="curator" className="rounded-md border border-slate-400 bg-white px-3 py-2 text-slate-900 shadow-sm">
            <option value="curator">curator</option>
            <option value="member">member</option>
          </select>
        </div>
        <button type="submit" className="rounded-md border border-slate-300 bg-white px-4 py-2 text-sm font-semibold text-slate-800 hover:bg-slate-100">Review the transfer…</button>
      </form>
    );
  }
  const { member, stepDownTo } = chosen;
  return (
    <ActionForm action={transfer} className="flex flex-col gap-3 rounded-md border border-amber-300 bg-amber-50 p-4 text-sm text-amber-950" label="Confirm the transfer of ownership">
      <input type="hidden" name="slug" value={slug} />
      <input type="hidden" name="userId" value={member.userId} />
      <input type="hidden" name="formerOwnerRole" value={stepDownTo} />
      <p className="font-semibold">Make {member.name} the owner of {groupName}?</p>
      <ul className="list-disc pl-5">
        <li>{member.name} becomes owner{member.role === 'owner' ? ' (already one)' : ''} and can manage members and roles.</li>
        <li>You become {stepDownTo}: you can no longer change members, roles or ownership{stepDownTo === 'member' ? ', review or publish' : ''}.</li>
        <li>Only an owner can undo this, by handing ownership back.</li>
      </ul>
      <div className="flex flex-wrap gap-2">
        <SubmitButton pendingText="Transferring…">Transfer ownership to {member.name}</SubmitButton>
        <Link href={`/groups/${slug}/members`} className="rounded-md border border-slate-300 bg-white px-4 py-2 font-semibold text-slate-800 hover:bg-slate-100">Cancel</Link>
      </div>
    </ActionForm>
  );
}
