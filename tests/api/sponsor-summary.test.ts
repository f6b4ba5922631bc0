// The sponsor summary: who may read it, which lines it covers, totals against a hand-computed
// fixture, filters, paging, the CSV against the screen's JSON, and the build team's view.
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createOwnedBuild, signedInClient } from '../helpers/accounts';
import { createEpisode, createUser } from '../helpers/factories';
import { TestClient } from '../helpers/http-client';
import { addSponsorMember, createPartLine, createSponsor } from '../helpers/sponsors';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
const c = {} as Record<'member' | 'otherMember' | 'follower' | 'admin' | 'owner' | 'visitor', TestClient>;
let sponsorSlug: string;
let otherSlug: string;
let sponsorId: number;
let publicBuild: { id: number; slug: string };
let unlistedBuildId: number;
let ownerHandle: string;

const day = (d: string) => new Date(`${d}T12:00:00Z`);

beforeAll(async () => {
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: '1000' } });
  const db = app.deps.db;
  const s = await createSponsor(db, { name: 'Sump & Seal', slug: 'sump-and-seal' });
  const t = await createSponsor(db, { name: 'Tappet Trading', slug: 'tappet-trading' });
  ({ id: sponsorId, slug: sponsorSlug } = s);
  otherSlug = t.slug;
  const emails = { member: 'sum-member', otherMember: 'sum-other', follower: 'sum-follower', admin: 'sum-admin', owner: 'sum-owner' };
  const users: Record<string, number> = {};
  for (const [k, e] of Object.entries(emails)) {
    if (k === 'owner') continue;
    users[k] = (await createUser(db, { email: `${e}@example.test`, is_admin: k === 'admin' })).id;
  }
  await addSponsorMember(db, s.id, users.member!);
  await addSponsorMember(db, t.id, users.otherMember!);
  // An admin who is no member: admins keep organisations, they do not read their summaries.

  const P = await createOwnedBuild(db, {
    owner: { email: 'sum-owner@example.test' },
    build: { title: 'Alpha hatchback', visibility: 'public' },
  });
  publicBuild = { id: P.build.id, slug: P.build.slug };
  ownerHandle = P.owner.handle;
  const U = await createOwnedBuild(db, { build: { title: 'Beta two-stroke', visibility: 'unlisted', currency: 'GBP' } });
  unlistedBuildId = U.build.id;
  const X = await createOwnedBuild(db, { build: { title: 'Gamma private', visibility: 'private' } });

  const pe1 = await createEpisode(db, { build_id: P.build.id, title: 'Strip-down', published_at: day('2026-10-05') });
  await db
    .insertInto('chapters')
    .values([
      { episode_id: pe1.id, position: 0, start_seconds: 0, title: 'On the stands' },
      { episode_id: pe1.id, position: 1, start_seconds: 300, title: 'Brakes apart' },
    ])
    .execute();
  const pe2 = await createEpisode(db, { build_id: P.build.id, title: 'Brakes back on', published_at: day('2026-11-20') });
  const pDraft = await createEpisode(db, { build_id: P.build.id, title: 'Not yet', status: 'draft', published_at: null });
  const pScheduled = await createEpisode(db, {
    build_id: P.build.id,
    title: 'Coming soon',
    status: 'scheduled',
    published_at: new Date(Date.now() + 10 * 86_400_000),
    publish_at: new Date(Date.now() + 10 * 86_400_000),
  });
  const pDeleted = await createEpisode(db, {
    build_id: P.build.id,
    title: 'Binned',
    published_at: day('2026-10-10'),
    deleted_at: new Date(),
  });
  const ue1 = await createEpisode(db, { build_id: U.build.id, title: 'Carb clean', published_at: day('2026-11-02') });
  const xe1 = await createEpisode(db, { build_id: X.build.id, title: 'Secret', published_at: day('2026-10-07') });

  const S = { sponsor_id: s.id };
  // The fixture. Value given = round(quantity × list price) − round(quantity × price paid), at least 0
  // (DESIGN.md "Money words"; migration 2026-12-03_0700).
  await createPartLine(db, {
    build_id: P.build.id,
    episode_id: pe1.id,
    ...S,
    support_kind: 'gifted',
    description: 'L1 brake hoses',
    quantity: '2',
    list_price_minor: 1250,
    unit_price_minor: 0,
    at_seconds: 320,
  }); // 2×1250 − 0 = 2500 EUR
  await createPartLine(db, {
    build_id: P.build.id,
    episode_id: pe1.id,
    ...S,
    support_kind: 'discounted',
    description: 'L2 master cylinder',
    list_price_minor: 4000,
    unit_price_minor: 2500,
  }); // 4000 − 2500 = 1500 EUR
  await createPartLine(db, {
    build_id: P.build.id,
    episode_id: pe1.id,
    sponsor_id: t.id,
    support_kind: 'gifted',
    description: 'L3 other sponsor',
    list_price_minor: 9999,
  }); // Tappet's, never Sump's
  await createPartLine(db, {
    build_id: P.build.id,
    episode_id: pe2.id,
    ...S,
    support_kind: 'discounted',
    description: 'L4 brake pads',
    quantity: '3',
    list_price_minor: 333,
    unit_price_minor: 200,
  }); // 999 − 600 = 399 EUR
  await createPartLine(db, {
    build_id: P.build.id,
    episode_id: pe2.id,
    ...S,
    support_kind: 'gifted',
    description: 'L5 returned',
    status: 'returned',
    list_price_minor: 1000,
  }); // returned: gave nothing
  await createPartLine(db, {
    build_id: P.build.id,
    episode_id: pDraft.id,
    ...S,
    support_kind: 'gifted',
    description: 'L6 draft',
    list_price_minor: 700,
  }); // 700, team view only
  await createPartLine(db, {
    build_id: P.build.id,
    episode_id: pScheduled.id,
    ...S,
    support_kind: 'gifted',
    description: 'L7 scheduled',
    list_price_minor: 800,
  }); // 800, team view only
  await createPartLine(db, {
    build_id: U.build.id,
    episode_id: ue1.id,
    ...S,
    support_kind: 'gifted',
    description: 'L8 jets',
    quantity: '1.5',
    list_price_minor: 1999,
    currency: 'GBP',
  }); // round(2998.5) = 2999 GBP
  await createPartLine(db, {
    build_id: X.build.id,
    episode_id: xe1.id,
    ...S,
    support_kind: 'gifted',
    description: 'L9 private',
    list_price_minor: 5000,
  }); // private build: never
  await createPartLine(db, {
    build_id: P.build.id,
    episode_id: pDeleted.id,
    ...S,
    support_kind: 'gifted',
    description: 'L10 deleted',
    list_price_minor: 6000,
  }); // deleted episode: never
  await createPartLine(db, { build_id: P.build.id, episode_id: pe2.id, description: 'L11 no support', unit_price_minor: 1234 }); // not supported: never

  for (const [k, e] of Object.entries(emails)) c[k as keyof typeof c] = await signedInClient(app, `${e}@example.test`);
  c.visitor = new TestClient(app.baseUrl);
});
afterAll(async () => {
  await app?.stop();
});

type Line = { description: string; valueGivenMinor: number; unpublished: boolean; publishedOn: string | null; momentPath: string };
const descriptions = (lines: Line[]) => lines.map((l) => l.description.slice(0, 3).trim());

describe('who may read it', () => {
  it('a member reads its own organisation; another sponsor, a follower, the build owner, an admin and a visitor get 404', async () => {
    expect((await c.member.get(`/api/sponsors/${sponsorSlug}/summary`)).status).toBe(200);
    for (const who of ['otherMember', 'follower', 'owner', 'admin', 'visitor'] as const) {
      const res = await c[who].get(`/api/sponsors/${sponsorSlug}/summary`);
      expect(res.status, who).toBe(404);
      expect(res.body.error.code).toBe('not_found');
      expect((await c[who].get(`/api/sponsors/${sponsorSlug}/summary.csv`)).status, `${who} csv`).toBe(404);
    }
    // An organisation that does not exist looks the same.
    expect((await c.member.get('/api/sponsors/no-such-sponsor/summary')).status).toBe(404);
  });

  it('one sponsor never sees another’s lines', async () => {
    const other = await c.otherMember.get(`/api/sponsors/${otherSlug}/summary`);
    expect(descriptions(other.body.lines.items)).toEqual(['L3']);
    const mine = await c.member.get(`/api/sponsors/${sponsorSlug}/summary?perPage=100`);
    expect(descriptions(mine.body.lines.items)).not.toContain('L3');
  });
});

describe('the sponsor’s view', () => {
  it('covers only published lines on public and unlisted builds, and matches the hand-computed totals', async () => {
    const res = await c.member.get(`/api/sponsors/${sponsorSlug}/summary?perPage=100`);
    expect(res.status).toBe(200);
    // Newest first: L4 (20 Nov), L8 (2 Nov, unlisted), L1 and L2 (5 Oct). Never L5 (returned), L6
    // (draft), L7 (scheduled), L9 (private build), L10 (deleted episode), L11 (no support).
    expect(descriptions(res.body.lines.items)).toEqual(['L4', 'L8', 'L1', 'L2']);
    expect(res.body.lines.items.every((l: Line) => !l.unpublished)).toBe(true);
    // Per currency, never added across: EUR 2500 + 1500 + 399 = 4399 over 3 lines, episodes 1 and 2, one build;
    // GBP 2999, one line. First and last appearance are the episodes' publication days (UTC).
    expect(res.body.totals).toEqual([
      { currency: 'EUR', valueGivenMinor: 4399, lines: 3, episodes: 2, builds: 1, firstOn: '2026-10-05', lastOn: '2026-11-20' },
      { currency: 'GBP', valueGivenMinor: 2999, lines: 1, episodes: 1, builds: 1, firstOn: '2026-11-02', lastOn: '2026-11-02' },
    ]);
    // By month: October EUR 2500 + 1500 = 4000; November EUR 399 and GBP 2999.
    expect(res.body.series).toEqual([
      { month: '2026-10', currency: 'EUR', valueGivenMinor: 4000 },
      { month: '2026-11', currency: 'EUR', valueGivenMinor: 399 },
      { month: '2026-11', currency: 'GBP', valueGivenMinor: 2999 },
    ]);
    expect(res.body.lines.total).toBe(4);
    expect(res.body.builds.map((b: { title: string }) => b.title)).toEqual(['Alpha hatchback', 'Beta two-stroke']);
    expect(res.body.sponsor).toMatchObject({ slug: sponsorSlug, name: 'Sump & Seal' });
  });

  it('gives each line its build, episode, chapter and a link to its moment', async () => {
    const res = await c.member.get(`/api/sponsors/${sponsorSlug}/summary?perPage=100`);
    const l1 = res.body.lines.items.find((l: Line) => l.description.startsWith('L1'));
    expect(l1.chapter).toEqual({ title: 'Brakes apart', startSeconds: 300 });
    expect(l1.momentPath).toBe(`${l1.episode.path}#at-320`);
    expect(l1.episode.path.startsWith(`/builds/${ownerHandle}/${publicBuild.slug}/episodes/`)).toBe(true);
    expect(l1).toMatchObject({
      quantity: '2',
      listPriceMinor: 1250,
      unitPriceMinor: 0,
      valueGivenMinor: 2500,
      kind: 'gifted',
      publishedOn: '2026-10-05',
    });
    const l2 = res.body.lines.items.find((l: Line) => l.description.startsWith('L2'));
    expect(l2.chapter).toBeNull();
    expect(l2.momentPath).toBe(l2.episode.path);
    // The link opens the episode page for a reader who is not on the team.
    expect((await fetch(`${app.baseUrl}${l1.episode.path}`)).status).toBe(200);
  });

  it('filters by build, kind and date range, with totals of the filter', async () => {
    const byBuild = await c.member.get(`/api/sponsors/${sponsorSlug}/summary?build=${unlistedBuildId}`);
    expect(descriptions(byBuild.body.lines.items)).toEqual(['L8']);
    expect(byBuild.body.totals.map((t: { currency: string }) => t.currency)).toEqual(['GBP']);
    // The build filter's choices stay those of the whole summary.
    expect(byBuild.body.builds).toHaveLength(2);
    // Discounted only: EUR 1500 + 399 = 1899, two lines in two episodes.
    const byKind = await c.member.get(`/api/sponsors/${sponsorSlug}/summary?kind=discounted`);
    expect(byKind.body.totals).toEqual([
      { currency: 'EUR', valueGivenMinor: 1899, lines: 2, episodes: 2, builds: 1, firstOn: '2026-10-05', lastOn: '2026-11-20' },
    ]);
    // From 1 November: L4 (EUR 399) and L8 (GBP 2999); to 31 October: L1 and L2 (EUR 4000).
    const from = await c.member.get(`/api/sponsors/${sponsorSlug}/summary?from=2026-11-01`);
    expect(descriptions(from.body.lines.items)).toEqual(['L4', 'L8']);
    const to = await c.member.get(`/api/sponsors/${sponsorSlug}/summary?to=2026-10-31`);
    expect(to.body.totals).toEqual([
      { currency: 'EUR', valueGivenMinor: 4000, lines: 2, episodes: 1, builds: 1, firstOn: '2026-10-05', lastOn: '2026-10-05' },
    ]);
    const none = await c.member.get(`/api/sponsors/${sponsorSlug}/summary?from=2027-01-01`);
    expect(none.body).toMatchObject({ totals: [], series: [], lines: { items: [], total: 0 } });
    // A bad filter is 400 naming the field, never a silent empty answer.
    const bad = await c.member.get(`/api/sponsors/${sponsorSlug}/summary?from=2026-02-30&kind=bribed`);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['from', 'kind']);
  });

  it('pages the lines', async () => {
    const p1 = await c.member.get(`/api/sponsors/${sponsorSlug}/summary?perPage=3`);
    const p2 = await c.member.get(`/api/sponsors/${sponsorSlug}/summary?perPage=3&page=2`);
    expect(p1.body.lines).toMatchObject({ page: 1, perPage: 3, total: 4 });
    expect([...descriptions(p1.body.lines.items), ...descriptions(p2.body.lines.items)]).toEqual(['L4', 'L8', 'L1', 'L2']);
    // Totals cover the whole filter, not the page.
    expect(p2.body.totals).toEqual(p1.body.totals);
  });

  it('exports the same rows as the screen, in the same order, as CSV', async () => {
    for (const filter of ['', 'kind=gifted', `build=${publicBuild.id}&from=2026-10-01&to=2026-10-31`]) {
      const screen = await c.member.get(`/api/sponsors/${sponsorSlug}/summary?perPage=100&${filter}`);
      const res = await fetch(`${app.baseUrl}/api/sponsors/${sponsorSlug}/summary.csv?${filter}`, {
        headers: { cookie: c.member.cookie! },
      });
      expect(res.status).toBe(200);
      expect(res.headers.get('content-type')).toContain('text/csv');
      expect(res.headers.get('content-disposition')).toContain(`${sponsorSlug}-summary.csv`);
      const rows = Papa.parse<Record<string, string>>(await res.text(), { header: true, skipEmptyLines: true }).data;
      expect(rows).toHaveLength(screen.body.lines.total);
      screen.body.lines.items.forEach((l: Line & Record<string, never>, i: number) => {
        const r = rows[i]!;
        // A description starting with "=" is guarded against spreadsheet formulas with a leading quote.
        expect(r.description!.replace(/^'/, '')).toBe(l.description);
        expect(r.published_on).toBe(l.publishedOn);
        expect(r.moment_url).toBe(`${app.deps.config.PUBLIC_URL.replace(/\/$/, '')}${l.momentPath}`);
        expect(r.value_given).toBe((l.valueGivenMinor / 100).toFixed(2));
        expect(r.status).toBe('published');
      });
    }
    const csv = await (
      await fetch(`${app.baseUrl}/api/sponsors/${sponsorSlug}/summary.csv`, { headers: { cookie: c.member.cookie! } })
    ).text();
    // L8: 1.5 × 19.99 GBP list, nothing paid; value given 29.99 (round(2998.5) = 2999 minor units).
    expect(csv).toContain('Beta two-stroke');
    expect(csv).toMatch(/L8 jets,1\.5,GBP,19\.99,0\.00,29\.99,gifted,published/);
  });
});

describe('the build team’s view', () => {
  it('shows the team every line of its own build, unpublished ones marked, and the CSV says so too', async () => {
    const res = await c.owner.get(`/api/builds/${publicBuild.id}/sponsors/${sponsorId}/summary?perPage=100`);
    expect(res.status).toBe(200);
    const items = res.body.lines.items as Line[];
    // Unpublished first (draft L6 and scheduled L7), then the published ones of this build only.
    expect(descriptions(items).slice(0, 2).sort()).toEqual(['L6', 'L7']);
    expect(descriptions(items).slice(2)).toEqual(['L4', 'L1', 'L2']);
    expect(
      items
        .filter((l) => l.unpublished)
        .map((l) => l.description.slice(0, 2))
        .sort(),
    ).toEqual(['L6', 'L7']);
    expect(items.filter((l) => l.unpublished).every((l) => l.publishedOn === null)).toBe(true);
    // EUR 2500 + 1500 + 399 + 700 (draft) + 800 (scheduled) = 5899 over five lines; returned L5 still left out.
    expect(res.body.totals).toHaveLength(1);
    expect(res.body.totals[0]).toMatchObject({ currency: 'EUR', valueGivenMinor: 5899, lines: 5 });
    const csv = await fetch(`${app.baseUrl}/api/builds/${publicBuild.id}/sponsors/${sponsorId}/summary.csv`, {
      headers: { cookie: c.owner.cookie! },
    });
    const rows = Papa.parse<Record<string, string>>(await csv.text(), { header: true, skipEmptyLines: true }).data;
    expect(
      rows
        .filter((r) => r.status === 'not yet published')
        .map((r) => r.description!.slice(0, 2))
        .sort(),
    ).toEqual(['L6', 'L7']);
    // The build's sponsors, for the links from its settings.
    const sponsors = await c.owner.get(`/api/builds/${publicBuild.id}/sponsor-summaries`);
    expect(sponsors.body.items.map((s: { slug: string }) => s.slug)).toEqual([sponsorSlug, otherSlug]);
  });

  it('is the team’s alone, and an unknown sponsor is 404', async () => {
    expect((await c.member.get(`/api/builds/${publicBuild.id}/sponsors/${sponsorId}/summary`)).status).toBe(403);
    expect((await c.visitor.get(`/api/builds/${publicBuild.id}/sponsors/${sponsorId}/summary`)).status).toBe(401);
    expect((await c.owner.get(`/api/builds/${publicBuild.id}/sponsors/999999/summary`)).status).toBe(404);
  });
});
