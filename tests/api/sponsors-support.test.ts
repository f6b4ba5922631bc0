// Sponsors, the creator's half: support on part lines (round trip, refusals naming the field, the
// linked supplier's suggestion), sponsorships of a build (owner only), credits on the build page.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addBuildMember, createOwnedBuild, signedInClient } from '../helpers/accounts';
import { createEpisode, createUser } from '../helpers/factories';
import { TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
let owner: TestClient;
let editor: TestClient;
let visitor: TestClient;
let buildId: number;
let buildSlug: string;
let episodeId: number;
let sponsorA: number;
let sponsorB: number;
let linkedSupplier: number;

beforeAll(async () => {
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: '1000' } });
  const db = app.deps.db;
  const { build } = await createOwnedBuild(db, {
    owner: { handle: 'support-owner', email: 'support-owner@example.test' },
    build: { slug: 'support-build', title: 'Support build', currency: 'GBP' },
  });
  buildId = build.id;
  buildSlug = build.slug;
  const ed = await createUser(db, { email: 'support-editor@example.test' });
  await addBuildMember(db, buildId, ed.id, 'editor');
  episodeId = (await createEpisode(db, { build_id: buildId, status: 'draft', published_at: null })).id;
  sponsorA = (
    await db
      .insertInto('sponsors')
      .values({ slug: 'larchmere-spares', name: 'Larchmere Spares', website: 'https://larchmere.example' })
      .returning('id')
      .executeTakeFirstOrThrow()
  ).id;
  sponsorB = (
    await db
      .insertInto('sponsors')
      .values({ slug: 'tolland-tools', name: 'Tolland Tools', website: null })
      .returning('id')
      .executeTakeFirstOrThrow()
  ).id;
  linkedSupplier = (await db.insertInto('suppliers').values({ name: 'Larchmere Counter' }).returning('id').executeTakeFirstOrThrow()).id;
  await db.insertInto('sponsor_suppliers').values({ sponsor_id: sponsorA, supplier_id: linkedSupplier }).execute();
  owner = await signedInClient(app, 'support-owner@example.test');
  editor = await signedInClient(app, 'support-editor@example.test');
  visitor = new TestClient(app.baseUrl);
});
afterAll(async () => {
  await app?.stop();
});

const line = (extra: Record<string, unknown>) => ({
  currency: 'GBP',
  unitPriceMinor: 0,
  kind: 'part',
  description: 'Clutch cable',
  ...extra,
});

describe('support on part lines', () => {
  it('round-trips kind, sponsor and list price, and works out the value given', async () => {
    const res = await editor.post(
      `/api/episodes/${episodeId}/part-lines`,
      line({
        quantity: '2',
        unitPriceMinor: 900,
        supportKind: 'discounted',
        sponsorId: sponsorA,
        listPriceMinor: 1250,
      }),
    );
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({
      supportKind: 'discounted',
      listPriceMinor: 1250,
      sponsor: { id: sponsorA, name: 'Larchmere Spares' },
    });
    // Value given = 2 × 12.50 − 2 × 9.00 = 7.00 (DESIGN.md "Money words", worked by hand).
    expect(res.body.valueGivenMinor).toBe(700);
    const patched = await editor.patch(`/api/part-lines/${res.body.id}`, { supportKind: 'gifted', unitPriceMinor: 0 });
    expect(patched.status, JSON.stringify(patched.body)).toBe(200);
    // Gifted: 2 × 12.50 − 0 = 25.00.
    expect(patched.body).toMatchObject({ supportKind: 'gifted', valueGivenMinor: 2500, sponsor: { id: sponsorA } });
    const list = await editor.get(`/api/episodes/${episodeId}/part-lines`);
    expect(list.body.items.find((l: { id: number }) => l.id === res.body.id)).toMatchObject({
      supportKind: 'gifted',
      listPriceMinor: 1250,
    });
  });

  it.each([
    ['an unknown sponsor', { supportKind: 'gifted', sponsorId: 999_999 }, 'sponsorId'],
    [
      'a discounted list price below the price paid',
      { unitPriceMinor: 900, supportKind: 'discounted', sponsorId: 0, listPriceMinor: 800 },
      'listPriceMinor',
    ],
    [
      'a discounted list price equal to the price paid',
      { unitPriceMinor: 900, supportKind: 'discounted', sponsorId: 0, listPriceMinor: 900 },
      'listPriceMinor',
    ],
    ['a gifted line with a price paid', { unitPriceMinor: 500, supportKind: 'gifted', sponsorId: 0 }, 'unitPriceMinor'],
    ['a list price on an unsupported line', { listPriceMinor: 500 }, 'listPriceMinor'],
    ['support on a sale line', { kind: 'sale', supportKind: 'gifted', sponsorId: 0 }, 'supportKind'],
    ['an unknown kind of support', { supportKind: 'loaned' }, 'supportKind'],
  ])('refuses %s with 400 naming the field, saving nothing', async (_name, extra, field) => {
    const body = { ...extra } as Record<string, unknown>;
    if (body.sponsorId === 0) body.sponsorId = sponsorB;
    const before = await app.deps.db
      .selectFrom('part_lines')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .executeTakeFirstOrThrow();
    const res = await owner.post(`/api/episodes/${episodeId}/part-lines`, line(body));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_request');
    expect(Object.keys(res.body.error.fields ?? {})).toContain(field);
    const after = await app.deps.db
      .selectFrom('part_lines')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .executeTakeFirstOrThrow();
    expect(after.n).toBe(before.n);
  });

  it('suggests the sponsor behind a linked supplier but never sets it', async () => {
    const res = await owner.post(`/api/episodes/${episodeId}/part-lines`, line({ supplierId: linkedSupplier }));
    expect(res.status).toBe(201);
    expect(res.body.sponsor).toBeNull();
    expect(res.body.supportKind).toBeNull();
    expect(res.body.suggestedSponsor).toMatchObject({ id: sponsorA, name: 'Larchmere Spares' });
    const suppliers = await owner.get('/api/suppliers?q=larchmere');
    expect(suppliers.body.items[0]).toMatchObject({ id: linkedSupplier, sponsor: { id: sponsorA } });
  });

  it('lists sponsor organisations publicly for pickers', async () => {
    const res = await visitor.get('/api/sponsors');
    expect(res.status).toBe(200);
    expect(res.body.items.map((s: { name: string }) => s.name)).toEqual(['Larchmere Spares', 'Tolland Tools']);
    expect(res.body.items[0]).toMatchObject({ website: 'https://larchmere.example', logoUrl: null });
  });
});

describe('sponsorships', () => {
  it('lets the owner add, change, list and remove them; others may not', async () => {
    const body = { sponsorId: sponsorB, kind: 'paid', startsOn: '2026-11-01', endsOn: '2027-01-31' };
    expect((await editor.post(`/api/builds/${buildId}/sponsorships`, body)).status).toBe(403);
    expect((await visitor.get(`/api/builds/${buildId}/sponsorships`)).status).toBe(401);
    const created = await owner.post(`/api/builds/${buildId}/sponsorships`, body);
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body).toMatchObject({ buildId, kind: 'paid', startsOn: '2026-11-01', endsOn: '2027-01-31', sponsor: { id: sponsorB } });
    const changed = await owner.put(`/api/sponsorships/${created.body.id}`, { ...body, endsOn: null });
    expect(changed.status).toBe(200);
    expect(changed.body.endsOn).toBeNull();
    expect((await editor.put(`/api/sponsorships/${created.body.id}`, body)).status).toBe(403);
    const list = await owner.get(`/api/builds/${buildId}/sponsorships`);
    expect(list.body.items).toHaveLength(1);
    expect((await editor.delete(`/api/sponsorships/${created.body.id}`)).status).toBe(403);
    expect((await owner.delete(`/api/sponsorships/${created.body.id}`)).status).toBe(204);
    expect((await owner.get(`/api/builds/${buildId}/sponsorships`)).body.items).toHaveLength(0);
  });

  it('refuses bad dates and unknown sponsors naming the field', async () => {
    const bad = await owner.post(`/api/builds/${buildId}/sponsorships`, {
      sponsorId: sponsorB,
      kind: 'paid',
      startsOn: '2026-12-01',
      endsOn: '2026-11-01',
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toContain('endsOn');
    const unknown = await owner.post(`/api/builds/${buildId}/sponsorships`, {
      sponsorId: 999_999,
      kind: 'gifted',
      startsOn: '2026-12-01',
      endsOn: null,
    });
    expect(unknown.status).toBe(400);
    expect(Object.keys(unknown.body.error.fields)).toContain('sponsorId');
    const notADay = await owner.post(`/api/builds/${buildId}/sponsorships`, {
      sponsorId: sponsorB,
      kind: 'gifted',
      startsOn: '2026-02-30',
      endsOn: null,
    });
    expect(Object.keys(notADay.body.error.fields)).toContain('startsOn');
  });

  it('credits the build’s sponsors on the build page', async () => {
    await owner.post(`/api/builds/${buildId}/sponsorships`, { sponsorId: sponsorB, kind: 'gifted', startsOn: '2026-10-01', endsOn: null });
    const res = await visitor.get(`/api/builds/${buildId}/overview`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    // Sponsor A supports lines of a draft only, so readers do not see it credited yet.
    expect(res.body.sponsors.map((s: { name: string }) => s.name)).toEqual(['Tolland Tools']);
    void buildSlug;
  });
});
