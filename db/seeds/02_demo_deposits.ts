import type { Knex } from 'knex';
import { depositDemo, type DemoActor, type DemoOutcome, type DemoPlan } from '../../lib/demo/deposit-demo';
import { demoDeposits, type DemoDeposit } from './demo-data';

// The demo datasets, deposited through the same operations authors and curators use (lib/demo/deposit-demo.ts),
// so that every screen shows real uploads, analyses, DOIs and states. Runs after 01_demo.ts (users and groups).

const EMBARGO_DAYS = 120;

/** Which state each demo deposit ends in, so the demo shows every state of a dataset's life. */
function outcomeOf(d: DemoDeposit): DemoOutcome {
  if (!d.publish) return 'draft';
  if (d.groupSlug === 'cobalt-ridge-magnetotransport') return /Hall/i.test(d.title) ? 'embargoed' : 'in_review';
  return 'published';
}

function embargoDate(now = new Date()): string {
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() + EMBARGO_DAYS)).toISOString().slice(0, 10);
}

/** An earlier, withdrawn upload of one deposit: same files, its own title, taken down with a public reason. */
function withdrawnCopy(d: DemoDeposit): DemoDeposit {
  const title = `${d.title} (first upload)`;
  return { ...d, title, record: { ...d.record, title } };
}

async function actor(knex: Knex, email: string): Promise<DemoActor> {
  const u = await knex('users').where({ email }).first('id', 'name', 'site_role');
  if (!u) throw new Error(`demo user ${email} is missing (01_demo.ts runs first)`);
  return { id: u.id, name: u.name, siteRole: u.site_role };
}

/** A curator or owner of the group other than the author where there is one (four eyes, common practice). */
async function stewardOf(knex: Knex, groupSlug: string, authorId: string): Promise<DemoActor> {
  const rows = await knex('memberships as m').join('groups as g', 'g.id', 'm.group_id').join('users as u', 'u.id', 'm.user_id')
    .where('g.slug', groupSlug).whereIn('m.role', ['curator', 'owner'])
    .orderByRaw("m.user_id = ? , FIELD(m.role, 'curator', 'owner')", [authorId])
    .select('u.id', 'u.name', 'u.site_role');
  if (!rows[0]) throw new Error(`group ${groupSlug} has no curator or owner`);
  return { id: rows[0].id, name: rows[0].name, siteRole: rows[0].site_role };
}

export async function seed(knex: Knex): Promise<void> {
  const deposits = demoDeposits();
  const plans: { d: DemoDeposit; outcome: DemoOutcome }[] = deposits.map((d) => ({ d, outcome: outcomeOf(d) }));
  const published = deposits.find((d) => outcomeOf(d) === 'published' && d.groupSlug === 'tidewater-thin-films');
  if (published) plans.push({ d: withdrawnCopy(published), outcome: 'withdrawn' });

  for (const { d, outcome } of plans) {
    if (await knex('dataset_versions').where({ title: d.title }).first('id')) continue; // seeded before
    const author = await actor(knex, d.authorEmail);
    const plan: DemoPlan = {
      author, steward: await stewardOf(knex, d.groupSlug, author.id), groupSlug: d.groupSlug, title: d.title, record: d.record,
      files: d.files, outcome, embargoUntil: outcome === 'embargoed' ? embargoDate() : undefined,
    };
    const t = Date.now();
    await depositDemo(plan);
    console.log(`seed: ${outcome.padEnd(9)} ${d.title} (${Date.now() - t} ms)`);
  }
}
