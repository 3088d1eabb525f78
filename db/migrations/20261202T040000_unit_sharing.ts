import type { Kysely } from 'kysely';

// Whether players see the line's unit-level numbers (readiness, line dashboard). Off by default:
// the staff turns it on. Frozen in time: never import application code here.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('teams').addColumn('share_unit_with_players', 'boolean', (c) => c.notNull().defaultTo(false)).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('teams').dropColumn('share_unit_with_players').execute();
}
