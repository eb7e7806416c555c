// The group and audit API over HTTP against the app `npm test` serves, signed in as demo users.
// Request bodies: schemas/api/ (create-group, create-invitation, change-member-role, transfer-ownership, audit-query);
// error body `{ error: { code, message, details, requestId } }` (lib/http/handler.ts).
import { describe, expect, it } from 'vitest';
import demo from '@/db/seeds/demo-accounts.json';
import { baseUrl } from '@/tests/support/e2e';
import { HttpSession } from '@/tests/support/http-session';

const reuser = demo.accounts.find((a) => a.email.startsWith('reuser@'))!; // in no group
const member = demo.accounts.find((a) => a.email.startsWith('ada.'))!; // member of larkspur-cryogenic
const curator = demo.accounts.find((a) => a.email.startsWith('tobin.'))!; // curator of larkspur-cryogenic
const admin = demo.accounts.find((a) => a.siteRole === 'admin')!;

type ApiError = { error: { code: string; message: string; details?: { fieldErrors?: Record<string, string> }; requestId: string } };
type Member = { userId: string; name: string; role: string; email?: string };

async function signedIn(email: string): Promise<HttpSession> {
  const http = new HttpSession(baseUrl);
  expect((await http.signInWithPassword(email, demo.password)).status).toBe(200);
  return http;
}

function send(http: HttpSession, method: string, path: string, body?: unknown): Promise<Response> {
  return http.fetch(path, { method, headers: { 'content-type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });
}

async function expectError(response: Response, status: number, code: string): Promise<ApiError['error']> {
  const body = (await response.json()) as ApiError;
  expect([response.status, body.error.code]).toEqual([status, code]);
  expect(body.error.requestId).toBe(response.headers.get('x-request-id'));
  return body.error;
}

// Set by the creating test; the group stays (there is no group deletion).
let owner: HttpSession | undefined;
let slug: string | undefined;

describe('groups API', () => {
  it('lists groups publicly and refuses to create one without a session (401)', async () => {
    const anon = new HttpSession(baseUrl);
    const list = await anon.fetch('/api/v1/groups');
    expect(list.status).toBe(200);
    const { groups } = (await list.json()) as { groups: { slug: string; yourRole: string | null; memberCount: number }[] };
    expect(groups.find((g) => g.slug === 'larkspur-cryogenic')).toMatchObject({ yourRole: null });
    await expectError(await send(anon, 'POST', '/api/v1/groups', { name: 'Anonymous group' }), 401, 'not_signed_in');
  });

  it('a user in no group creates one (201) and owns it; a bad address is 422 with the field', async () => {
    owner = await signedIn(reuser.email);
    const name = `Fernwick API Bench ${Date.now()}`;
    const created = await send(owner, 'POST', '/api/v1/groups', { name, institution: 'Fernwick Station (invented)' });
    expect(created.status).toBe(201);
    const group = (await created.json()) as { id: string; slug: string; name: string };
    slug = group.slug;
    expect(group).toMatchObject({ name, slug: name.toLowerCase().replace(/ /g, '-') });
    const bad = await expectError(await send(owner, 'POST', '/api/v1/groups', { name: 'Fine', slug: 'Not Valid' }), 422, 'validation_failed');
    expect(Object.keys(bad.details?.fieldErrors ?? {})).toEqual(['slug']);

    const members = await owner.fetch(`/api/v1/groups/${slug}/members`);
    const body = (await members.json()) as { access: string; yourRole: string; members: Member[] };
    expect([body.access, body.yourRole, body.members.map((m) => [m.name, m.role, m.email])]).toEqual(['full', 'owner', [[reuser.name, 'owner', reuser.email]]]);
    const detail = (await (await owner.fetch(`/api/v1/groups/${slug}`)).json()) as { storage: { quotaBytes: number; summary: string } | null; datasets: unknown[] };
    expect(detail.storage).toMatchObject({ quotaBytes: 50 * 1024 ** 3, summary: '0 B of 50.0 GiB used (0 %), 50.0 GiB free' });
    expect(detail.datasets).toEqual([]);
  });

  it('invites by e-mail (201, never returning the token), lists and withdraws the invitation', async () => {
    const email = `api-invitee-${Date.now()}@invitee.example`;
    const invited = await send(owner!, 'POST', `/api/v1/groups/${slug}/invitations`, { email, role: 'curator' });
    expect(invited.status).toBe(201);
    const result = (await invited.json()) as { invitation: { id: string; email: string; role: string; status: string }; delivery: string };
    expect(result).toMatchObject({ invitation: { email, role: 'curator', status: 'pending' }, delivery: 'sent' });
    expect(JSON.stringify(result)).not.toMatch(/[A-Za-z0-9_-]{43}/);
    const listed = (await (await owner!.fetch(`/api/v1/groups/${slug}/invitations`)).json()) as { invitations: { id: string }[] };
    expect(listed.invitations.map((i) => i.id)).toEqual([result.invitation.id]);
    expect((await send(owner!, 'DELETE', `/api/v1/groups/${slug}/invitations/${result.invitation.id}`)).status).toBe(200);
    await expectError(await send(owner!, 'DELETE', `/api/v1/groups/${slug}/invitations/${result.invitation.id}`), 404, 'not_found');
    await expectError(await send(owner!, 'POST', `/api/v1/groups/${slug}/invitations`, { email: 'nope', role: 'member' }), 422, 'validation_failed');
  });

  it('the only owner cannot step down or leave (409); other groups’ members cannot change roles (403)', async () => {
    const me = ((await (await owner!.fetch(`/api/v1/groups/${slug}/members`)).json()) as { members: Member[] }).members[0];
    const e = await expectError(await send(owner!, 'PATCH', `/api/v1/groups/${slug}/members/${me.userId}`, { role: 'curator' }), 409, 'conflict');
    expect(e.message).toContain('A group always needs at least one owner.');
    await expectError(await send(owner!, 'DELETE', `/api/v1/groups/${slug}/members/${me.userId}`), 409, 'conflict');
    const outsider = await signedIn(member.email);
    await expectError(await send(outsider, 'PATCH', `/api/v1/groups/${slug}/members/${me.userId}`, { role: 'member' }), 403, 'forbidden');
    await expectError(await send(outsider, 'POST', `/api/v1/groups/${slug}/transfer-ownership`, { userId: me.userId }), 403, 'forbidden');
  });
});

describe('audit API', () => {
  it('an owner reads their group’s log with filters; a curator of another group is refused; admins read all', async () => {
    const log = await owner!.fetch(`/api/v1/audit?group=${slug}&action=group.invitation_created`);
    const page = (await log.json()) as { scope: { kind: string }; total: number; entries: { action: string; details: { role: string } }[] };
    expect([log.status, page.scope.kind, page.total, page.entries[0].details.role]).toEqual([200, 'group', 1, 'curator']);
    await expectError(await (await signedIn(curator.email)).fetch(`/api/v1/audit?group=${slug}`), 403, 'forbidden');
    await expectError(await owner!.fetch('/api/v1/audit'), 403, 'forbidden');
    await expectError(await owner!.fetch(`/api/v1/audit?group=${slug}&from=yesterday`), 422, 'validation_failed');
    const all = (await (await (await signedIn(admin.email)).fetch(`/api/v1/audit?action=group.create&pageSize=200`)).json()) as { scope: { kind: string }; entries: { group: { slug: string } | null }[] };
    expect(all.scope.kind).toBe('all');
    expect(all.entries.map((e) => e.group?.slug)).toContain(slug);
  });

  it('the site-wide audit page is a plain 404 for non-admins', async () => {
    expect((await owner!.fetch('/admin/audit')).status).toBe(404);
    expect((await (await signedIn(admin.email)).fetch('/admin/audit')).status).toBe(200);
  });
});
