import 'server-only';
import schema from '@/schemas/api/transfer-ownership.schema.json';
import { AppError } from '@/lib/errors';
import type { GroupActor } from './group-access';
import { memberView, requireMember, roleIn, type MemberView } from './member-rules';
import { asObject, fieldError, parseWith, tidy } from './parse-input';
import { runMembershipPlan } from './repo-members';
import { requireGroup, requireSignedIn } from './require-group';

export type TransferBody = { userId: string; formerOwnerRole?: 'curator' | 'member' };
export type TransferResult = { newOwner: MemberView; formerOwner: MemberView };

export function parseTransferBody(body: unknown): TransferBody {
  const input = tidy(asObject(body, 'Send a JSON object with "userId" of the new owner.'), ['formerOwnerRole']);
  return parseWith<TransferBody>(schema, input, { userId: 'Choose the member who becomes owner.', formerOwnerRole: 'Choose curator or member.' });
}

/**
 * An owner hands the group to another member in one transaction: the member becomes owner, the former owner
 * steps down (to curator unless told otherwise). The group has an owner before, during and after.
 */
export async function transferOwnership(args: { user: GroupActor | null; slug: string; input: unknown }): Promise<TransferResult> {
  const user = requireSignedIn(args.user, 'transfer ownership');
  const body = parseTransferBody(args.input);
  const stepDownTo = body.formerOwnerRole ?? 'curator';
  const group = await requireGroup(args.slug);
  return runMembershipPlan(group.id, (locked) => {
    if (roleIn(locked, user.id) !== 'owner') {
      throw new AppError('forbidden', `Only an owner of ${locked.name} can hand over ownership. Site admins change roles on the members page instead.`);
    }
    if (body.userId === user.id) throw fieldError('userId', 'Choose another member; you are an owner already.');
    const target = requireMember(locked, body.userId);
    const me = requireMember(locked, user.id);
    const changes = [
      ...(target.role === 'owner' ? [] : [{ kind: 'set_role' as const, userId: target.userId, role: 'owner' as const }]),
      { kind: 'set_role' as const, userId: me.userId, role: stepDownTo },
    ];
    return {
      changes,
      audit: [{
        action: 'group.ownership_transferred', actorKind: 'user', actorUserId: user.id, groupId: locked.id, targetType: 'user', targetId: target.userId,
        details: { to: target.name, targetFormerRole: target.role, formerOwnerRole: stepDownTo },
      }],
      result: { newOwner: memberView(target, 'owner'), formerOwner: memberView(me, stepDownTo) },
    };
  });
}
