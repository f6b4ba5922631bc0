import currencyCodes from 'currency-codes';
import { sql, type Kysely } from 'kysely';

// Parts: site-wide suppliers, per-system budgets, and part lines whose amounts (net, tax, gross in
// the line's own currency) are generated columns computed by PostgreSQL, by the rounding rule of
// src/shared/money.ts: quantity × unit price rounded once, half away from zero (round(numeric)),
// then tax from that rounded amount, rounded once. Totals are grouped SQL over these columns.
export async function up(db: Kysely<any>): Promise<void> {
  // ISO 4217 minor-unit exponents, for converting a line to its build's currency in SQL.
  await db.schema
    .createTable('currencies')
    .addColumn('code', sql`char(3)`, (c) => c.primaryKey())
    .addColumn('exponent', 'smallint', (c) => c.notNull().check(sql`exponent between 0 and 4`))
    .execute();
  const rows = currencyCodes
    .codes()
    .map((code) => ({ code, exponent: currencyCodes.code(code)?.digits }))
    .filter((r): r is { code: string; exponent: number } => typeof r.exponent === 'number' && r.code.length === 3);
  await db.insertInto('currencies').values(rows).execute();

  await db.schema
    .createTable('suppliers')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('name', 'text', (c) => c.notNull().check(sql`length(name) between 1 and 120`))
    .addColumn('website', 'text')
    .addColumn('merged_into_id', 'bigint', (c) => c.references('suppliers.id').onDelete('set null'))
    .addColumn('created_by', 'bigint', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  // One live record per name (case and spacing ignored); merged ones keep their name for history.
  await sql`create unique index suppliers_name_key on suppliers (lower(btrim(name))) where merged_into_id is null`.execute(db);
  await db.schema.createIndex('suppliers_merged_into_idx').on('suppliers').column('merged_into_id').execute();
  await db.schema.createIndex('suppliers_created_by_idx').on('suppliers').column('created_by').execute();

  await db.schema
    .alterTable('build_systems')
    .addColumn('budget_minor', 'bigint', (c) => c.check(sql`budget_minor >= 0`))
    .execute();

  await db.schema
    .createTable('part_lines')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('build_id', 'bigint', (c) => c.notNull().references('builds.id').onDelete('cascade'))
    .addColumn('episode_id', 'bigint', (c) => c.notNull().references('episodes.id').onDelete('cascade'))
    .addColumn('position', 'integer', (c) => c.notNull())
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('part', 'consumable', 'tool', 'service', 'sale')`))
    .addColumn('description', 'text', (c) => c.notNull())
    .addColumn('part_number', 'text')
    .addColumn('supplier_id', 'bigint', (c) => c.references('suppliers.id').onDelete('set null'))
    .addColumn('system_key', 'text')
    .addColumn('at_seconds', 'integer', (c) => c.check(sql`at_seconds >= 0`))
    .addColumn('source', 'text', (c) => c.notNull().check(sql`source in ('new', 'used', 'reconditioned', 'reused', 'made')`))
    .addColumn('status', 'text', (c) => c.notNull().check(sql`status in ('needed', 'on-order', 'arrived', 'fitted', 'returned')`))
    .addColumn('quantity', sql`numeric(12,3)`, (c) => c.notNull().check(sql`quantity > 0`))
    .addColumn('unit', 'text', (c) => c.notNull().defaultTo('each'))
    .addColumn('unit_price_minor', 'bigint', (c) => c.notNull().check(sql`unit_price_minor >= 0`))
    .addColumn('currency', sql`char(3)`, (c) => c.notNull().references('currencies.code'))
    .addColumn('tax_rate_bp', 'integer', (c) =>
      c
        .notNull()
        .defaultTo(0)
        .check(sql`tax_rate_bp between 0 and 10000`),
    )
    .addColumn('tax_included', 'boolean', (c) => c.notNull().defaultTo(true))
    .addColumn('fx_rate', sql`numeric(18,8)`, (c) => c.check(sql`fx_rate > 0`))
    .addColumn('avoided_cost_minor', 'bigint', (c) => c.check(sql`avoided_cost_minor >= 0`))
    .addColumn('buy_url', 'text')
    .addColumn('affiliate', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('open_item_id', 'bigint', (c) => c.references('open_items.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  // amount = round(quantity × unit price); the numerator gets ten decimal places so the division is
  // exact enough that round() sees a true half (see money.ts for the rule).
  const amount = 'round(quantity * unit_price_minor)';
  const tax = `case when tax_included
      then round(${amount} * tax_rate_bp::numeric(20,10) / (10000 + tax_rate_bp))
      else round(${amount} * tax_rate_bp::numeric(20,10) / 10000) end`;
  await sql
    .raw(
      `alter table part_lines
         add column gross_minor bigint generated always as (case when tax_included then ${amount} else ${amount} + ${tax} end) stored,
         add column tax_minor bigint generated always as (${tax}) stored,
         add column net_minor bigint generated always as (case when tax_included then ${amount} - ${tax} else ${amount} end) stored,
         add column search_vector tsvector generated always as (
           to_tsvector('english', description || ' ' || coalesce(part_number, ''))) stored`,
    )
    .execute(db);

  for (const col of ['build_id', 'episode_id', 'supplier_id', 'open_item_id']) {
    await db.schema.createIndex(`part_lines_${col}_idx`).on('part_lines').column(col).execute();
  }
  await db.schema.createIndex('part_lines_build_status_idx').on('part_lines').columns(['build_id', 'status']).execute();
  await db.schema.createIndex('part_lines_episode_position_idx').on('part_lines').columns(['episode_id', 'position']).execute();
  await sql`create index part_lines_search_idx on part_lines using gin (search_vector)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('part_lines').execute();
  await db.schema.alterTable('build_systems').dropColumn('budget_minor').execute();
  await db.schema.dropTable('suppliers').execute();
  await db.schema.dropTable('currencies').execute();
}
