import type { Knex } from 'knex';
import { randomUUID } from 'node:crypto';
import { hash } from '@node-rs/argon2';
import demo from './demo-accounts.json';

// The demo scenario: three invented labs of an invented consortium and their people. Idempotent: a second run
// keeps existing rows. The datasets come next, through the deposit code path (02_demo_deposits.ts).

const GROUPS = [
  { slug: 'larkspur-cryogenic', name: 'Larkspur Cryogenic Lab', institution: 'Northfell Institute of Technology (invented)', description: 'Low-temperature resistivity of metals and superconducting wires, 20 mK to 300 K.' },
  { slug: 'tidewater-thin-films', name: 'Tidewater Thin Films Group', institution: 'Saltmarsh University (invented)', description: 'Sheet resistance and Hall effect of oxide and chalcogenide films by van der Pauw and Hall-bar methods.' },
  { slug: 'cobalt-ridge-magnetotransport', name: 'Cobalt Ridge Magnetotransport Lab', institution: 'Cobalt Ridge Field Facility (invented)', description: 'Magnetoresistance and Hall measurements in fields up to 30 T with AC lock-in detection.' },
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
}
