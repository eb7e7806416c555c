import type { Knex } from 'knex';
import { randomUUID } from 'node:crypto';
import { hash } from '@node-rs/argon2';
import demo from './demo-accounts.json';

// The demo scenario: three invented labs of an invented consortium. Idempotent: a second run keeps existing rows.

const GROUPS = [
  { slug: 'larkspur-cryogenic', name: 'Larkspur Cryogenic Lab', institution: 'Northfell Institute of Technology (invented)', description: 'Low-temperature resistivity of metals and superconducting wires, 20 mK to 300 K.' },
  { slug: 'tidewater-thin-films', name: 'Tidewater Thin Films Group', institution: 'Saltmarsh University (invented)', description: 'Sheet resistance and Hall effect of oxide and chalcogenide films by van der Pauw and Hall-bar methods.' },
  { slug: 'cobalt-ridge-magnetotransport', name: 'Cobalt Ridge Magnetotransport Lab', institution: 'Cobalt Ridge Field Facility (invented)', description: 'Magnetoresistance and Hall measurements in fields up to 30 T with AC lock-in detection.' },
];

const PLACEHOLDER_DATASETS = [
  { group: 'larkspur-cryogenic', by: 'ada.penhallow@larkspur.example', title: 'Four-wire ρ(T) of an annealed copper wire, 2–300 K', state: 'published' },
  { group: 'larkspur-cryogenic', by: 'ada.penhallow@larkspur.example', title: 'Niobium wire resistive transition near 9 K (draft)', state: 'draft' },
  { group: 'tidewater-thin-films', by: 'joss.merriweather@tidewater.example', title: 'Van der Pauw sheet resistance of a 40 nm oxide film', state: 'in_review' },
  { group: 'cobalt-ridge-magnetotransport', by: 'noor.halvorsen@cobaltridge.example', title: 'Hall bar Rxx and Rxy of a layered semimetal to 14 T', state: 'published', embargoDays: 120 },
];

async function ensureUser(knex: Knex, a: (typeof demo.accounts)[number], passwordHash: string): Promise<string> {
  const existing = await knex('users').where({ email: a.email }).first('id');
  if (existing) return existing.id;
  const id = randomUUID();
  await knex('users').insert({ id, email: a.email, name: a.name, password_hash: passwordHash, site_role: a.siteRole ?? 'user', email_verified_at: new Date() });
  return id;
}

export async function seed(knex: Knex): Promise<void> {
  const passwordHash = await hash(demo.password, { memoryCost: 19_456, timeCost: 2, parallelism: 1 });
  const groupIds = new Map<string, string>();
  for (const g of GROUPS) {
    const existing = await knex('groups').where({ slug: g.slug }).first('id');
    const id = existing?.id ?? randomUUID();
    if (!existing) await knex('groups').insert({ id, ...g });
    groupIds.set(g.slug, id);
  }
  const userIds = new Map<string, string>();
  for (const a of demo.accounts) userIds.set(a.email, await ensureUser(knex, a, passwordHash));

  const memberships = [
    ...demo.accounts.filter((a) => a.group && a.role).map((a) => ({ email: a.email, group: a.group!, role: a.role! })),
    ...demo.extraMemberships,
  ];
  for (const m of memberships) {
    const row = { group_id: groupIds.get(m.group)!, user_id: userIds.get(m.email)! };
    if (!(await knex('memberships').where(row).first())) await knex('memberships').insert({ ...row, role: m.role });
  }

  for (const d of PLACEHOLDER_DATASETS) {
    const groupId = groupIds.get(d.group)!;
    if (await knex('dataset_versions').where({ title: d.title }).first()) continue;
    const datasetId = randomUUID();
    const createdBy = userIds.get(d.by)!;
    await knex('datasets').insert({ id: datasetId, group_id: groupId, created_by: createdBy });
    const now = new Date();
    const embargo = d.embargoDays ? new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() + d.embargoDays)) : null;
    await knex('dataset_versions').insert({
      id: randomUUID(), dataset_id: datasetId, version_number: 1, state: d.state, title: d.title,
      metadata: JSON.stringify({ title: d.title, creators: [{ name: demo.accounts.find((a) => a.email === d.by)!.name }] }),
      embargo_until: embargo, created_by: createdBy,
      submitted_at: d.state !== 'draft' ? now : null, published_at: d.state === 'published' ? now : null,
    });
  }
}
