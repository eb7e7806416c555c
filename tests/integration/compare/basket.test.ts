// The compare basket against MariaDB: add (a version alone takes its main curve), list with sources, the 12-curve
// limit, merging a browser's basket, removal, and curves that become unavailable. Access decided by lib/access.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AccessDeniedError } from '@/lib/access';
import { addCompareItems } from '@/lib/compare/add-compare-items';
import { getCompareBasket } from '@/lib/compare/get-compare-basket';
import { removeCompareItems } from '@/lib/compare/remove-compare-items';
import { insertCompareItems, listCompareItems } from '@/lib/compare/repo';
import { resolveCurves } from '@/lib/compare/resolve-curves';
import { db } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { closeDb, createTestLab, dropTestLabs, type TestLab } from '../uploads/helpers';
import { deposit, fixtureMeta, reopenForCleanup, type Deposit } from './fixtures';

let lab: TestLab;
let otherLab: TestLab;
let copper: Deposit;
let film: Deposit;
let otherDraft: Deposit;

beforeAll(async () => {
  lab = await createTestLab();
  otherLab = await createTestLab();
  copper = await deposit(lab, 'cu-wire-rt.csv', fixtureMeta('cu-wire-rt.meta.json'));
  film = await deposit(otherLab, 'tidewater-film-rs.csv', fixtureMeta('tidewater-film-rs.meta.json'));
  otherDraft = await deposit(otherLab, 'cobalt-ridge-hallbar.dat', fixtureMeta('cobalt-ridge-hallbar.meta.json'), { state: 'draft' });
}, 120_000);

afterAll(async () => {
  await reopenForCleanup(lab);
  await reopenForCleanup(otherLab);
  await dropTestLabs();
  await closeDb();
});

async function refusal(promise: Promise<unknown>): Promise<{ status: number; code: string; message: string }> {
  try {
    await promise;
  } catch (e) {
    if (e instanceof AppError || e instanceof AccessDeniedError) return { status: e.status, code: e.code, message: e.message };
    throw e;
  }
  throw new Error('expected a refusal');
}

describe('adding and listing', () => {
  it('a version alone adds its main curve: ρ(T) computed from R and the wire geometry', async () => {
    const r = await addCompareItems({ user: lab.outsider, input: { versionId: copper.versionId } });
    expect(r.items).toEqual([expect.objectContaining({ outcome: 'added', ref: { versionId: copper.versionId, fileId: copper.fileId, x: 'T', y: 'resistivity' } })]);
    expect([r.count, r.max, r.rejected]).toEqual([1, 12, []]);
  });

  it('adding the same curve again keeps the one item (idempotent)', async () => {
    const r = await addCompareItems({ user: lab.outsider, input: { fileId: copper.fileId, x: 'T', y: 'resistivity' } });
    expect(r.items[0].outcome).toBe('present');
    expect(await listCompareItems(lab.outsider.id)).toHaveLength(1);
  });

  it('lists the basket with each source: title, version, DOI, group, file, and every curve of the file', async () => {
    await addCompareItems({ user: lab.outsider, input: { versionId: film.versionId, fileId: film.fileId, x: 'T', y: 'Rs' } });
    const basket = await getCompareBasket({ user: lab.outsider });
    expect(basket.unavailable).toEqual([]);
    expect(basket.entries.map((e) => [e.source?.title, e.source?.versionNumber, e.source?.doi, e.source?.group.slug, e.chosen])).toEqual([
      ['R(T) of annealed copper wire LCL-Cu-W07, 2–300 K', 1, copper.doi, lab.slug, { x: 'T', y: 'resistivity' }],
      [expect.any(String), 1, film.doi, otherLab.slug, { x: 'T', y: 'Rs' }],
    ]);
    const copperEntry = basket.entries[0];
    expect(copperEntry.options.map((o) => `${o.y.quantity}(${o.x.quantity}) in ${o.y.ucum}`)).toEqual(['resistance(temperature) in Ohm', 'resistivity(temperature) in Ohm.m']);
    expect(copperEntry.options[1].points[0]).toEqual([300, expect.closeTo(1.7262754e-8, 14)]);
  });

  it('refuses a draft of another group as not found (404), whether named by version or by file', async () => {
    const byVersion = await refusal(addCompareItems({ user: lab.member, input: { versionId: otherDraft.versionId } }));
    expect(byVersion).toEqual({ status: 404, code: 'not_found', message: 'We could not find this dataset version, or you do not have access to it.' });
    expect((await refusal(addCompareItems({ user: lab.member, input: { fileId: otherDraft.fileId } }))).status).toBe(404);
    // A file id with another version's id is not a way round the check.
    expect((await refusal(addCompareItems({ user: lab.member, input: { versionId: copper.versionId, fileId: otherDraft.fileId } }))).status).toBe(404);
  });

  it('refuses a curve the file does not have, and a body that names nothing', async () => {
    expect(await refusal(addCompareItems({ user: lab.member, input: { fileId: copper.fileId, x: 'T', y: 'Rxy' } }))).toMatchObject({
      status: 404, message: "The curve Rxy against T is not in this file's analysis (any more).",
    });
    expect((await refusal(addCompareItems({ user: lab.member, input: { x: 'T', y: 'R' } }))).status).toBe(422);
    expect((await refusal(addCompareItems({ user: lab.member, input: { versionId: copper.versionId, items: [{ versionId: copper.versionId }] } }))).status).toBe(422);
  });
});

describe('merging a browser basket (batch)', () => {
  it('adds what the user may see and says why the rest was not added', async () => {
    const r = await addCompareItems({ user: lab.member, input: { items: [{ versionId: copper.versionId }, { versionId: otherDraft.versionId }, { fileId: film.fileId, x: 'T', y: 'resistivity' }] } });
    expect(r.items.map((i) => [i.outcome, i.ref.y])).toEqual([['added', 'resistivity'], ['added', 'resistivity']]);
    expect(r.rejected).toEqual([{ ref: { versionId: otherDraft.versionId }, message: 'We could not find this dataset version, or you do not have access to it.' }]);
  });
});

describe('the 12-curve limit', () => {
  it('accepts 12 curves, then answers 409 with a clear message', async () => {
    const user = lab.member;
    await removeCompareItems({ user, id: null, all: true });
    // Ten more references to columns the file does not have: enough to fill the basket (they show as unavailable).
    const filler = Array.from({ length: 10 }, (_, i) => ({ versionId: copper.versionId, fileId: copper.fileId, x: 'T', y: `gone-${i}` }));
    await addCompareItems({ user, input: { items: [{ versionId: copper.versionId }, { fileId: copper.fileId, x: 'T', y: 'R' }] } });
    const filled = await insertCompareItems(user.id, filler, 12);
    expect(filled.map((o) => o.outcome)).toEqual(Array(10).fill('added'));
    const full = await refusal(addCompareItems({ user, input: { fileId: film.fileId, x: 'T', y: 'Rs' } }));
    expect(full).toEqual({
      status: 409, code: 'conflict',
      message: 'The compare basket holds at most 12 curves, so one overlay stays readable. Remove a curve to add another.',
    });
    const batch = await addCompareItems({ user, input: { items: [{ fileId: film.fileId, x: 'T', y: 'Rs' }] } });
    expect(batch.rejected[0].message).toMatch(/^The compare basket holds at most 12 curves/);
    expect(batch.count).toBe(12);
  });

  it('lists items whose curve is gone as unavailable, with their id so they can be removed', async () => {
    const basket = await getCompareBasket({ user: lab.member });
    expect(basket.entries).toHaveLength(2);
    expect(basket.unavailable).toHaveLength(10);
    expect(basket.unavailable[0].message).toBe("The curve gone-0 against T is not in this file's analysis (any more).");
    const first = basket.unavailable[0].key;
    expect(await removeCompareItems({ user: lab.member, id: first, all: false })).toEqual({ removed: 1 });
    expect((await listCompareItems(lab.member.id)).map((i) => i.id)).not.toContain(first);
  });
});

describe('removing and losing access', () => {
  it("cannot remove another user's item (404) or an unknown id", async () => {
    const [mine] = await listCompareItems(lab.outsider.id);
    expect((await refusal(removeCompareItems({ user: lab.member, id: mine.id, all: false }))).status).toBe(404);
    expect((await refusal(removeCompareItems({ user: lab.member, id: randomUUID(), all: false }))).status).toBe(404);
    expect((await refusal(removeCompareItems({ user: lab.member, id: null, all: false }))).status).toBe(422);
  });

  it('a withdrawn version leaves the basket as unavailable with the reason', async () => {
    await db()('dataset_versions').where({ id: film.versionId }).update({ state: 'withdrawn', withdrawn_at: new Date() });
    const basket = await getCompareBasket({ user: lab.outsider });
    expect(basket.entries.map((e) => e.ref?.versionId)).toEqual([copper.versionId]);
    expect(basket.unavailable).toEqual([expect.objectContaining({ message: 'You cannot view the curves while this version is withdrawn.' })]);
    await db()('dataset_versions').where({ id: film.versionId }).update({ state: 'published', withdrawn_at: null });
  });

  it('an anonymous browser basket is resolved the same way: the draft is not found', async () => {
    const r = await resolveCurves(null, [{ ref: { versionId: copper.versionId, fileId: copper.fileId, x: 'T', y: 'R' } }, { ref: { versionId: otherDraft.versionId } }]);
    expect(r.entries.map((e) => e.chosen)).toEqual([{ x: 'T', y: 'R' }]);
    expect(r.unavailable.map((u) => u.message)).toEqual(['We could not find this dataset version, or you do not have access to it.']);
  });

  it('emptying the basket removes every item', async () => {
    const before = (await listCompareItems(lab.member.id)).length;
    expect(await removeCompareItems({ user: lab.member, id: null, all: true })).toEqual({ removed: before });
    expect(await listCompareItems(lab.member.id)).toEqual([]);
  });
});
