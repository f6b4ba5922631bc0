import { sql, type Kysely } from 'kysely';

// Workshop figures recorded in an episode: a torque figure for a named fastener. The value stays in
// the unit it was recorded in; conversions happen when it is read.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('figures')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('episode_id', 'bigint', (c) => c.notNull().references('episodes.id').onDelete('cascade'))
    .addColumn('position', 'integer', (c) => c.notNull())
    .addColumn('fastener', 'text', (c) => c.notNull())
    .addColumn('thread', 'text', (c) => c.notNull())
    .addColumn('grade_fitted', 'text')
    .addColumn('grade_specified', 'text')
    .addColumn('method', 'text', (c) => c.notNull().check(sql`method in ('torque', 'torque-angle', 'snug')`))
    .addColumn('value', 'numeric', (c) => c.check(sql`value > 0`))
    .addColumn('unit', 'text', (c) => c.notNull().check(sql`unit in ('N-m', 'lbf-ft', 'lbf-in', 'kgf-m')`))
    .addColumn('angle_stages', 'jsonb', (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn('source', 'text', (c) => c.notNull().check(sql`source in ('workshop-manual', 'common-practice', 'measured', 'estimate')`))
    .addColumn('wrench_min', 'numeric')
    .addColumn('wrench_max', 'numeric')
    .addColumn('wrench_unit', 'text')
    .addColumn('system_key', 'text')
    .addColumn('note', 'text')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('figures_episode_position_key', ['episode_id', 'position'])
    .execute();
  await sql`alter table figures add constraint figures_wrench_range_check check (
    (wrench_min is null and wrench_max is null and wrench_unit is null)
    or (wrench_min > 0 and wrench_max > wrench_min and wrench_unit in ('N-m', 'lbf-ft', 'lbf-in', 'kgf-m')))`.execute(db);
  // The unique (episode_id, position) constraint's index also serves the episode_id foreign key.
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('figures').execute();
}
