import { sql, type Transaction } from 'kysely';
import type { Database, SupportKindColumn } from '../../db/database';
import { episodeDisclosure } from '../../services/disclosure';
import type { SeedSection } from '../section';

// Invented sponsors for the demo (DESIGN.md "Sponsor"): a parts supplier that stands behind one of
// the demo suppliers, and a tool maker with a paid sponsorship. No real brands; example domains only.
const SPONSORS = [
  {
    slug: 'quillon-motor-parts',
    name: 'Quillon Motor Parts',
    website: 'https://quillon-brake.example',
    member: 'dov-achterberg',
    supplier: 'Quillon Brake Supply',
  },
  { slug: 'tinderbox-tools', name: 'Tinderbox Tools', website: 'https://tinderbox-tools.example', member: 'wren-talbot', supplier: null },
] as const;

type SponsorSlug = (typeof SPONSORS)[number]['slug'];

/** Support on lines the parts section already seeded (found by build, episode and description). */
const SUPPORTED: Array<{
  build: string;
  episode: number;
  description: string;
  kind: SupportKindColumn;
  sponsor: SponsorSlug;
  listPrice: number;
}> = [
  {
    build: 'marlowe-pipit-1976',
    episode: 1,
    description: 'Front flexible brake hoses (pair)',
    kind: 'discounted',
    sponsor: 'quillon-motor-parts',
    listPrice: 4200,
  },
  {
    build: 'marlowe-pipit-1976',
    episode: 2,
    description: 'Caliper seal kit, 48 mm',
    kind: 'discounted',
    sponsor: 'quillon-motor-parts',
    listPrice: 1950,
  },
  {
    build: 'vantel-125-trail',
    episode: 1,
    description: 'Top-end gasket set',
    kind: 'discounted',
    sponsor: 'quillon-motor-parts',
    listPrice: 3400,
  },
];

/** Gifted tools added to the demo episodes (paid nothing; the list price is what they would have cost). */
const GIFTED = [
  {
    build: 'marlowe-pipit-1976',
    episode: 2,
    description: 'Brake bleeding kit, one-person',
    sponsor: 'tinderbox-tools',
    listPrice: 2995,
    system: 'brakes',
  },
  {
    build: 'vantel-125-trail',
    episode: 1,
    description: 'Piston ring compressor',
    sponsor: 'tinderbox-tools',
    listPrice: 1850,
    system: null,
  },
] as const;

async function episodeOf(trx: Transaction<Database>, buildSlug: string, number: number) {
  return trx
    .selectFrom('episodes as e')
    .innerJoin('builds as b', 'b.id', 'e.build_id')
    .select(['e.id', 'e.build_id', 'b.currency'])
    .where('b.slug', '=', buildSlug)
    .where('e.number', '=', number)
    .executeTakeFirst();
}

export const demoSponsorsSection: SeedSection = {
  key: 'demo-sponsors',
  version: 1,
  async run(trx) {
    const ids = new Map<string, number>();
    for (const s of SPONSORS) {
      const row = await trx
        .insertInto('sponsors')
        .values({ slug: s.slug, name: s.name, website: s.website })
        .onConflict((oc) => oc.column('slug').doUpdateSet({ name: s.name, website: s.website }))
        .returning('id')
        .executeTakeFirstOrThrow();
      ids.set(s.slug, row.id);
      const member = await trx.selectFrom('users').select('id').where('handle', '=', s.member).executeTakeFirst();
      if (member) {
        const has = await trx
          .selectFrom('sponsor_members')
          .select('id')
          .where('sponsor_id', '=', row.id)
          .where('user_id', '=', member.id)
          .executeTakeFirst();
        if (!has) await trx.insertInto('sponsor_members').values({ sponsor_id: row.id, user_id: member.id }).execute();
      }
      if (s.supplier) {
        const supplier = await trx
          .selectFrom('suppliers')
          .select('id')
          .where('name', '=', s.supplier)
          .where('merged_into_id', 'is', null)
          .executeTakeFirst();
        if (supplier)
          await trx
            .insertInto('sponsor_suppliers')
            .values({ sponsor_id: row.id, supplier_id: supplier.id })
            .onConflict((oc) => oc.column('supplier_id').doNothing())
            .execute();
      }
    }

    for (const l of SUPPORTED) {
      const e = await episodeOf(trx, l.build, l.episode);
      if (!e) continue;
      await trx
        .updateTable('part_lines')
        .set({ support_kind: l.kind, sponsor_id: ids.get(l.sponsor)!, list_price_minor: l.listPrice })
        .where('episode_id', '=', e.id)
        .where('description', '=', l.description)
        .where('unit_price_minor', '<', l.listPrice)
        .execute();
    }

    const tinderboxSupplier = await trx.selectFrom('suppliers').select('id').where('name', '=', 'Tinderbox Tools').executeTakeFirst();
    for (const g of GIFTED) {
      const e = await episodeOf(trx, g.build, g.episode);
      if (!e) continue;
      const has = await trx
        .selectFrom('part_lines')
        .select('id')
        .where('episode_id', '=', e.id)
        .where('description', '=', g.description)
        .executeTakeFirst();
      if (has) continue;
      const max = await trx
        .selectFrom('part_lines')
        .select(sql<number>`coalesce(max(position), -1)::int`.as('p'))
        .where('episode_id', '=', e.id)
        .executeTakeFirstOrThrow();
      await trx
        .insertInto('part_lines')
        .values({
          build_id: e.build_id,
          episode_id: e.id,
          position: max.p + 1,
          kind: 'tool',
          description: g.description,
          supplier_id: tinderboxSupplier?.id ?? null,
          system_key: g.system,
          source: 'new',
          status: 'arrived',
          quantity: '1',
          unit: 'each',
          unit_price_minor: 0,
          currency: e.currency,
          tax_rate_bp: 0,
          tax_included: true,
          support_kind: 'gifted',
          sponsor_id: ids.get(g.sponsor)!,
          list_price_minor: g.listPrice,
        })
        .execute();
    }

    // Sponsorships: the tool maker pays for the motorcycle build (from before its first episode,
    // open-ended); the parts supplier discounts parts for the hatchback.
    const sponsorships = [
      { build: 'vantel-125-trail', sponsor: 'tinderbox-tools', kind: 'paid' as const },
      { build: 'marlowe-pipit-1976', sponsor: 'quillon-motor-parts', kind: 'discounted' as const },
    ];
    for (const s of sponsorships) {
      const build = await trx.selectFrom('builds').select('id').where('slug', '=', s.build).executeTakeFirst();
      if (!build) continue;
      const sponsorId = ids.get(s.sponsor)!;
      const has = await trx
        .selectFrom('sponsorships')
        .select('id')
        .where('build_id', '=', build.id)
        .where('sponsor_id', '=', sponsorId)
        .where('kind', '=', s.kind)
        .executeTakeFirst();
      if (has) continue;
      const first = await trx
        .selectFrom('episodes')
        .select(
          sql<string>`to_char(coalesce(min(coalesce(published_at, publish_at, created_at)), now()) - interval '30 days', 'YYYY-MM-DD')`.as(
            'day',
          ),
        )
        .where('build_id', '=', build.id)
        .executeTakeFirstOrThrow();
      await trx
        .insertInto('sponsorships')
        .values({ build_id: build.id, sponsor_id: sponsorId, kind: s.kind, starts_on: first.day, ends_on: null })
        .execute();
    }

    // The demo's creators say so in their videos: published and scheduled episodes that need a
    // disclosure are confirmed, so they pass the publish checks.
    const episodes = await trx
      .selectFrom('episodes as e')
      .innerJoin('builds as b', 'b.id', 'e.build_id')
      .select(['e.id'])
      .where('b.slug', 'in', ['marlowe-pipit-1976', 'vantel-125-trail'])
      .where('e.status', 'in', ['published', 'scheduled'])
      .where('e.video_disclosure_confirmed', '=', false)
      .execute();
    for (const e of episodes) {
      if (await episodeDisclosure(trx, e.id))
        await trx.updateTable('episodes').set({ video_disclosure_confirmed: true }).where('id', '=', e.id).execute();
    }
  },
};
