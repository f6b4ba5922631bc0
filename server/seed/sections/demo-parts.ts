import { sql, type Transaction } from 'kysely';
import type { Database, PartKindColumn, PartSourceColumn, PartStatusColumn } from '../../db/database';
import type { SeedSection } from '../section';

// Invented suppliers and parts lists for the demo builds: no real shops, brands or part numbers.
const SUPPLIERS = [
  { name: 'Quillon Brake Supply', website: 'https://quillon-brake.example' },
  { name: 'Harlow Cray Parts', website: 'https://harlow-cray.example' },
  { name: 'Pellow & Dunne Motor Factors', website: 'https://pellow-dunne.example' },
  { name: 'Marsh End Breakers', website: null },
  { name: 'Tinderbox Tools', website: 'https://tinderbox-tools.example' },
  { name: 'Ferrow Machine Shop', website: null },
  { name: 'Cobbleway Two-Stroke Spares', website: 'https://cobbleway.example' },
];

interface DemoLine {
  kind: PartKindColumn;
  description: string;
  partNumber?: string;
  supplier?: string;
  system?: string;
  at?: number;
  source?: PartSourceColumn;
  status: PartStatusColumn;
  quantity?: string;
  unit?: string;
  price: number;
  currency?: string;
  taxBp?: number;
  fxRate?: string;
  avoided?: number;
  buyUrl?: string;
  affiliate?: boolean;
  /** Title of the open item the line waits for. */
  waitsFor?: string;
}

/** Per build: system budgets and the lines of each episode (by number). */
const PARTS: Record<string, { budgets: Record<string, number>; episodes: Record<number, DemoLine[]> }> = {
  'marlowe-pipit-1976': {
    budgets: { brakes: 25000, cooling: 15000, body: 120000, electrical: 30000 },
    episodes: {
      1: [
        {
          kind: 'service',
          description: 'Car trailer hire, one day',
          supplier: 'Harlow Cray Parts',
          status: 'arrived',
          price: 6500,
          taxBp: 2000,
        },
        {
          kind: 'tool',
          description: 'Tow strap, 5 t',
          supplier: 'Tinderbox Tools',
          status: 'arrived',
          price: 2490,
          taxBp: 2000,
          buyUrl: 'https://tinderbox-tools.example/tow-strap',
          affiliate: true,
        },
        {
          kind: 'part',
          description: 'Front flexible brake hoses (pair)',
          partNumber: 'QB-FH-310',
          supplier: 'Quillon Brake Supply',
          system: 'brakes',
          status: 'on-order',
          price: 3850,
          taxBp: 2000,
          waitsFor: 'Replace front flexible brake hoses',
        },
        { kind: 'sale', description: 'Spare steel wheels (four), sold', source: 'used', status: 'arrived', quantity: '4', price: 2000 },
      ],
      2: [
        {
          kind: 'part',
          description: 'Caliper seal kit, 48 mm',
          partNumber: 'QB-SK-48',
          supplier: 'Quillon Brake Supply',
          system: 'brakes',
          at: 640,
          status: 'fitted',
          quantity: '2',
          price: 1440,
          taxBp: 2000,
        },
        {
          kind: 'part',
          description: 'Caliper pistons, cleaned and reused',
          system: 'brakes',
          at: 640,
          source: 'reused',
          status: 'fitted',
          quantity: '2',
          price: 0,
          avoided: 4400,
        },
        {
          kind: 'consumable',
          description: 'Brake fluid DOT 4',
          supplier: 'Harlow Cray Parts',
          system: 'brakes',
          status: 'arrived',
          unit: 'litre',
          price: 1190,
          taxBp: 2000,
        },
        {
          kind: 'consumable',
          description: 'Penetrating oil, 400 ml',
          supplier: 'Harlow Cray Parts',
          at: 120,
          status: 'arrived',
          price: 750,
          taxBp: 2000,
        },
        // Bought from a shop abroad: the price in pounds, with the rate the creator's bank used.
        {
          kind: 'part',
          description: 'Front brake pads, axle set',
          partNumber: 'PD-4471',
          supplier: 'Pellow & Dunne Motor Factors',
          system: 'brakes',
          status: 'arrived',
          price: 3200,
          currency: 'GBP',
          taxBp: 2000,
          fxRate: '1.165',
        },
        { kind: 'tool', description: 'Brake pipe flaring tool', supplier: 'Tinderbox Tools', status: 'arrived', price: 4600, taxBp: 2000 },
      ],
      3: [
        {
          kind: 'part',
          description: 'Thermostat, 82 °C',
          partNumber: 'HC-TH82',
          supplier: 'Harlow Cray Parts',
          system: 'cooling',
          at: 300,
          status: 'fitted',
          price: 1860,
          taxBp: 2000,
        },
        {
          kind: 'part',
          description: 'Radiator cap, 0.9 bar',
          supplier: 'Harlow Cray Parts',
          system: 'cooling',
          status: 'fitted',
          price: 1240,
          taxBp: 2000,
        },
        {
          kind: 'service',
          description: 'Radiator recore',
          supplier: 'Ferrow Machine Shop',
          system: 'cooling',
          status: 'fitted',
          price: 18500,
          taxBp: 2000,
        },
        {
          kind: 'consumable',
          description: 'Coolant concentrate',
          supplier: 'Harlow Cray Parts',
          system: 'cooling',
          status: 'needed',
          quantity: '2.5',
          unit: 'litre',
          price: 680,
          taxBp: 2000,
          waitsFor: 'Refill and bleed the cooling system',
        },
        {
          kind: 'part',
          description: 'Hose support bracket, made from scrap steel',
          system: 'cooling',
          source: 'made',
          status: 'fitted',
          price: 0,
          avoided: 950,
        },
        {
          kind: 'part',
          description: 'Heater valve from a breaker',
          supplier: 'Marsh End Breakers',
          system: 'cooling',
          source: 'used',
          status: 'returned',
          price: 1500,
        },
      ],
    },
  },
  'vantel-125-trail': {
    budgets: { engine: 30000, fuel: 6000 },
    episodes: {
      1: [
        {
          kind: 'part',
          description: 'Top-end gasket set',
          partNumber: 'CW-GS125',
          supplier: 'Cobbleway Two-Stroke Spares',
          system: 'engine',
          status: 'arrived',
          price: 1895,
          currency: 'GBP',
          taxBp: 2000,
        },
        {
          kind: 'service',
          description: 'Rebore to first oversize',
          supplier: 'Ferrow Machine Shop',
          system: 'engine',
          status: 'on-order',
          price: 8500,
          currency: 'GBP',
          taxBp: 2000,
          waitsFor: 'Rebore to first oversize and new piston',
        },
        {
          kind: 'part',
          description: 'Piston kit, first oversize',
          supplier: 'Cobbleway Two-Stroke Spares',
          system: 'engine',
          status: 'needed',
          price: 6400,
          currency: 'GBP',
          taxBp: 2000,
          waitsFor: 'Rebore to first oversize and new piston',
        },
      ],
      2: [
        {
          kind: 'part',
          description: 'Fuel tap, reconditioned',
          supplier: 'Cobbleway Two-Stroke Spares',
          system: 'fuel',
          source: 'reconditioned',
          status: 'fitted',
          price: 2200,
          currency: 'GBP',
          taxBp: 2000,
        },
        {
          kind: 'consumable',
          description: 'Fuel hose, 5 mm bore',
          supplier: 'Cobbleway Two-Stroke Spares',
          system: 'fuel',
          status: 'fitted',
          quantity: '1.5',
          unit: 'metre',
          price: 420,
          currency: 'GBP',
          taxBp: 2000,
        },
        {
          kind: 'part',
          description: 'Tank cap seal, reused',
          system: 'fuel',
          source: 'reused',
          status: 'fitted',
          price: 0,
          currency: 'GBP',
          avoided: 600,
        },
      ],
    },
  },
};

async function supplierIds(trx: Transaction<Database>): Promise<Map<string, number>> {
  const ids = new Map<string, number>();
  for (const s of SUPPLIERS) {
    const found = await trx
      .selectFrom('suppliers')
      .select('id')
      .where(sql`lower(btrim(name))`, '=', s.name.toLowerCase())
      .where('merged_into_id', 'is', null)
      .executeTakeFirst();
    ids.set(s.name, found?.id ?? (await trx.insertInto('suppliers').values(s).returning('id').executeTakeFirstOrThrow()).id);
  }
  return ids;
}

/** Parts lists for the demo builds; an episode that already has lines (the creator's own edits) is left alone. */
export const demoPartsSection: SeedSection = {
  key: 'demo-parts',
  version: 1,
  async run(trx) {
    const suppliers = await supplierIds(trx);
    for (const [slug, data] of Object.entries(PARTS)) {
      const build = await trx.selectFrom('builds').select(['id', 'currency']).where('slug', '=', slug).executeTakeFirst();
      if (!build) continue;
      for (const [key, budget] of Object.entries(data.budgets)) {
        await trx
          .updateTable('build_systems')
          .set({ budget_minor: budget })
          .where('build_id', '=', build.id)
          .where('key', '=', key)
          .where('budget_minor', 'is', null)
          .execute();
      }
      for (const [number, lines] of Object.entries(data.episodes)) {
        const episode = await trx
          .selectFrom('episodes')
          .select('id')
          .where('build_id', '=', build.id)
          .where('number', '=', Number(number))
          .executeTakeFirst();
        if (!episode) continue;
        const has = await trx.selectFrom('part_lines').select('id').where('episode_id', '=', episode.id).executeTakeFirst();
        if (has) continue;
        for (const [position, l] of lines.entries()) {
          const openItem = l.waitsFor
            ? await trx
                .selectFrom('open_items')
                .select('id')
                .where('build_id', '=', build.id)
                .where('title', '=', l.waitsFor)
                .executeTakeFirst()
            : undefined;
          const currency = l.currency ?? build.currency;
          await trx
            .insertInto('part_lines')
            .values({
              build_id: build.id,
              episode_id: episode.id,
              position,
              kind: l.kind,
              description: l.description,
              part_number: l.partNumber ?? null,
              supplier_id: l.supplier ? suppliers.get(l.supplier)! : null,
              system_key: l.system ?? null,
              at_seconds: l.at ?? null,
              source: l.source ?? 'new',
              status: l.status,
              quantity: l.quantity ?? '1',
              unit: l.unit ?? 'each',
              unit_price_minor: l.price,
              currency,
              tax_rate_bp: l.taxBp ?? 0,
              tax_included: true,
              fx_rate: currency === build.currency ? null : (l.fxRate ?? null),
              avoided_cost_minor: l.avoided ?? null,
              buy_url: l.buyUrl ?? null,
              affiliate: l.affiliate ?? false,
              open_item_id: openItem?.id ?? null,
            })
            .execute();
        }
      }
    }
  },
};
