import { type Kysely, sql } from 'kysely';

// Development: goals a coach sets for a player (a component, a target plus rate, a date) and coach
// notes over time. Frozen in time: never import application code here.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('player_goals')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('player_id', 'bigint', (c) => c.notNull().references('players.id').onDelete('cascade'))
    .addColumn('component', 'text', (c) => c.notNull())
    .addColumn('target', sql`numeric(4, 3)`, (c) => c.notNull().check(sql`target > 0 AND target <= 1`))
    .addColumn('due_on', 'date')
    .addColumn('note', 'text')
    .addColumn('set_by', 'bigint', (c) => c.references('users.id'))
    .addColumn('achieved_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('player_goals_player_idx').on('player_goals').column('player_id').execute();
  await db.schema
    .createTable('player_notes')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('player_id', 'bigint', (c) => c.notNull().references('players.id').onDelete('cascade'))
    .addColumn('author_id', 'bigint', (c) => c.notNull().references('users.id'))
    .addColumn('body', 'text', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('player_notes_player_idx').on('player_notes').columns(['player_id', 'created_at']).execute();
  // Reports group final grades by player over sessions and by snap tags: index what they filter on.
  await db.schema.createIndex('film_sessions_team_kind_idx').on('film_sessions').columns(['team_id', 'season_id', 'kind']).execute();
  await db.schema.createIndex('snaps_session_concept_front_idx').on('snaps').columns(['session_id', 'concept_id', 'front_id']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex('snaps_session_concept_front_idx').ifExists().execute();
  await db.schema.dropIndex('film_sessions_team_kind_idx').ifExists().execute();
  await db.schema.dropTable('player_notes').ifExists().execute();
  await db.schema.dropTable('player_goals').ifExists().execute();
}
