import 'server-only';
import { randomUUID } from 'node:crypto';
import schema from '@/schemas/api/create-group.schema.json';
import { AppError } from '@/lib/errors';
import { isLimited, recordHit, type RateLimit } from '@/lib/rate-limit/rate-limit';
import type { GroupActor } from './group-access';
import { asObject, fieldError, parseWith, tidy } from './parse-input';
import { insertGroupWithOwner, isDuplicateKey, listSlugsLike } from './repo';
import { firstFreeSlug, slugFromName, slugProblem } from './slug';

export type CreateGroupBody = { name: string; slug?: string; institution?: string; description?: string };
export type CreatedGroup = { id: string; slug: string; name: string };

/** A person starts a few groups, not dozens: 10 a day keeps a scripted flood out of the group list. */
export const GROUPS_PER_USER: RateLimit = { name: 'group-create', max: 10, windowMs: 24 * 60 * 60_000 };

export function parseCreateGroupBody(body: unknown): CreateGroupBody {
  const input = tidy(asObject(body, 'Send a JSON object with at least "name".'), ['slug', 'institution', 'description']);
  const parsed = parseWith<CreateGroupBody>(schema, input, {
    name: 'Give the group a name of 3 to 200 characters.',
    slug: 'Use 3 to 80 lower-case letters a–z, digits and single hyphens between words.',
  });
  const problem = parsed.slug ? slugProblem(parsed.slug) : null;
  if (problem) throw fieldError('slug', problem);
  return parsed;
}

async function chooseSlug(body: CreateGroupBody): Promise<string> {
  if (body.slug) return body.slug;
  const base = slugFromName(body.name);
  // Names without letters a–z or digits (e.g. only Greek) get a neutral address the owner can live with.
  const start = slugProblem(base) === null ? base : `group-${randomUUID().slice(0, 8)}`;
  const free = firstFreeSlug(start, new Set(await listSlugsLike(start)));
  if (!free) throw fieldError('slug', `Every address starting "${start}" is taken; choose one yourself.`, 'conflict');
  return free;
}

/** Any signed-in user creates a group and becomes its only owner; the address is unique (409 when taken). */
export async function createGroup(args: { user: GroupActor | null; input: unknown }): Promise<CreatedGroup> {
  if (!args.user) throw new AppError('not_signed_in', 'Sign in to create a group.');
  const { user } = args;
  const body = parseCreateGroupBody(args.input);
  if (await isLimited(GROUPS_PER_USER, user.id)) {
    throw new AppError('rate_limited', 'You created 10 groups in the last day; wait a while before creating another.');
  }
  // A derived address may be taken between choosing and inserting: choose again, twice at most.
  for (let attempt = 0; ; attempt += 1) {
    const slug = await chooseSlug(body);
    const group = { id: randomUUID(), slug, name: body.name };
    try {
      await insertGroupWithOwner({ ...group, institution: body.institution ?? null, description: body.description ?? null, ownerId: user.id });
      await recordHit(GROUPS_PER_USER, user.id);
      return group;
    } catch (error) {
      if (!isDuplicateKey(error)) throw error;
      if (body.slug || attempt >= 2) throw fieldError('slug', `The address "${slug}" is taken; choose another.`, 'conflict');
    }
  }
}
