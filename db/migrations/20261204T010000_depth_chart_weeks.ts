import { type Kysely, sql } from 'kysely';

// Depth charts by week. A chart saved for week W is in force from week W until a later week's chart
// replaces it (weeks carry forward); week 0 is the base (preseason) chart, which every existing row
// becomes. The primary key leads with (season_id, week) so "the greatest saved week ≤ W" is an
// index lookup. Changes record the week they were saved for.
// Frozen in time: never import application code here.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('depth_chart_entries').addColumn('week', 'smallint', (c) => c.notNull().defaultTo(0).check(sql`week >= 0`)).execute();
  await db.schema.alterTable('depth_chart_entries').dropConstraint('depth_chart_entries_pk').execute();
  await db.schema.alterTable('depth_chart_entries').addPrimaryKeyConstraint('depth_chart_entries_pk', ['season_id', 'week', 'position', 'rank']).execute();
  await db.schema.alterTable('depth_chart_changes').addColumn('week', 'smallint', (c) => c.notNull().defaultTo(0).check(sql`week >= 0`)).execute();
  await db.schema.createIndex('depth_chart_changes_season_week_idx').on('depth_chart_changes').columns(['season_id', 'week', 'created_at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex('depth_chart_changes_season_week_idx').execute();
  await db.schema.alterTable('depth_chart_changes').dropColumn('week').execute();
  // Only the base chart fits the old key; later weeks' charts are dropped with the column.
  await db.deleteFrom('depth_chart_entries').where('week', '<>', 0).execute();
  await db.schema.alterTable('depth_chart_entries').dropConstraint('depth_chart_entries_pk').execute();
  await db.schema.alterTable('depth_chart_entries').dropColumn('week').execute();
  await db.schema.alterTable('depth_chart_entries').addPrimaryKeyConstraint('depth_chart_entries_pk', ['season_id', 'position', 'rank']).execute();
}
