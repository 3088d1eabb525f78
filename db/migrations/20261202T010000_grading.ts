import { type Kysely, sql } from 'kysely';

// Grading: each team's versioned scheme, the depth chart (starters fill the grading desk), the
// linemen on the field per snap, grades (one per coach, player and snap, versioned for optimistic
// concurrency) and session locks. Frozen in time: never import application code here.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('grading_schemes')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('team_id', 'bigint', (c) => c.notNull().references('teams.id').onDelete('cascade'))
    .addColumn('version', 'integer', (c) => c.notNull())
    .addColumn('rules', 'jsonb', (c) => c.notNull())
    .addColumn('designated_grader_role', 'text', (c) => c.notNull().defaultTo('coordinator').check(sql`designated_grader_role IN ('admin','coordinator','coach')`))
    .addColumn('created_by', 'bigint', (c) => c.references('users.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('grading_schemes_team_version_unique', ['team_id', 'version'])
    .execute();

  await db.schema
    .createTable('depth_chart_entries')
    .addColumn('season_id', 'bigint', (c) => c.notNull().references('seasons.id').onDelete('cascade'))
    .addColumn('position', 'text', (c) => c.notNull().check(sql`position IN ('LT','LG','C','RG','RT','TE')`))
    .addColumn('rank', 'smallint', (c) => c.notNull())
    .addColumn('player_id', 'bigint', (c) => c.notNull().references('players.id').onDelete('cascade'))
    .addPrimaryKeyConstraint('depth_chart_entries_pk', ['season_id', 'position', 'rank'])
    .execute();

  await db.schema
    .createTable('depth_chart_changes')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('season_id', 'bigint', (c) => c.notNull().references('seasons.id').onDelete('cascade'))
    .addColumn('changed_by', 'bigint', (c) => c.references('users.id'))
    .addColumn('reason', 'text')
    .addColumn('before', 'jsonb', (c) => c.notNull())
    .addColumn('after', 'jsonb', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable('snap_participants')
    .addColumn('snap_id', 'bigint', (c) => c.notNull().references('snaps.id').onDelete('cascade'))
    .addColumn('player_id', 'bigint', (c) => c.notNull().references('players.id').onDelete('cascade'))
    .addColumn('position', 'text', (c) => c.notNull().check(sql`position IN ('LT','LG','C','RG','RT','TE')`))
    .addPrimaryKeyConstraint('snap_participants_pk', ['snap_id', 'player_id'])
    .execute();

  await db.schema
    .createTable('grades')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('snap_id', 'bigint', (c) => c.notNull().references('snaps.id').onDelete('cascade'))
    .addColumn('player_id', 'bigint', (c) => c.notNull().references('players.id').onDelete('cascade'))
    .addColumn('grader_id', 'bigint', (c) => c.notNull().references('users.id'))
    .addColumn('scheme_version', 'integer', (c) => c.notNull())
    .addColumn('position', 'text')
    .addColumn('assignment', 'text', (c) => c.check(sql`assignment IN ('right','missed')`))
    .addColumn('missed_reason', 'text')
    .addColumn('footwork', 'text', (c) => c.check(sql`footwork IN ('plus','minus')`))
    .addColumn('hands', 'text', (c) => c.check(sql`hands IN ('plus','minus')`))
    .addColumn('pad_level', 'text', (c) => c.check(sql`pad_level IN ('plus','minus')`))
    .addColumn('extra', 'jsonb', (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('effort', 'text', (c) => c.check(sql`effort IN ('plus','minus','loaf')`))
    .addColumn('knockdowns', 'smallint', (c) => c.notNull().defaultTo(0))
    .addColumn('pressures_allowed', 'smallint', (c) => c.notNull().defaultTo(0))
    .addColumn('sacks_allowed', 'smallint', (c) => c.notNull().defaultTo(0))
    .addColumn('penalties', 'jsonb', (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn('penalty_count', 'smallint', (c) => c.notNull().defaultTo(0))
    .addColumn('note', 'text')
    .addColumn('result', 'text', (c) => c.check(sql`result IN ('plus','minus')`))
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('grades_snap_player_grader_unique', ['snap_id', 'player_id', 'grader_id'])
    .execute();
  await db.schema.createIndex('grades_player_idx').on('grades').columns(['player_id', 'snap_id']).execute();
  await db.schema.createIndex('grades_grader_idx').on('grades').columns(['grader_id', 'snap_id']).execute();

  await db.schema
    .createTable('grading_lock_events')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('session_id', 'bigint', (c) => c.notNull().references('film_sessions.id').onDelete('cascade'))
    .addColumn('action', 'text', (c) => c.notNull().check(sql`action IN ('locked','unlocked')`))
    .addColumn('by_user', 'bigint', (c) => c.references('users.id'))
    .addColumn('reason', 'text')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.alterTable('film_sessions').addColumn('grading_locked', 'boolean', (c) => c.notNull().defaultTo(false)).execute();
  // Whether players see their own grades (the staff decides; on by default).
  await db.schema.alterTable('teams').addColumn('share_grades_with_players', 'boolean', (c) => c.notNull().defaultTo(true)).execute();

  // The one place the final-grade rule lives: where several coaches graded the same player on the
  // same snap, the grade of a coach holding the team's designated grader role counts; otherwise the
  // earliest grade. Reports read this view, never the grades table directly.
  await sql`
    CREATE VIEW final_grades AS
    SELECT DISTINCT ON (g.snap_id, g.player_id) g.*, s.session_id
    FROM grades g
    JOIN snaps s ON s.id = g.snap_id
    JOIN film_sessions fs ON fs.id = s.session_id
    LEFT JOIN LATERAL (
      SELECT gs.designated_grader_role FROM grading_schemes gs
      WHERE gs.team_id = fs.team_id ORDER BY gs.version DESC LIMIT 1
    ) scheme ON true
    LEFT JOIN memberships m ON m.user_id = g.grader_id AND m.team_id = fs.team_id
    ORDER BY g.snap_id, g.player_id,
      (m.role IS NOT DISTINCT FROM coalesce(scheme.designated_grader_role, 'coordinator')) DESC,
      g.created_at, g.id`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`DROP VIEW IF EXISTS final_grades`.execute(db);
  await db.schema.alterTable('film_sessions').dropColumn('grading_locked').execute();
  await db.schema.alterTable('teams').dropColumn('share_grades_with_players').execute();
  for (const table of ['grading_lock_events', 'grades', 'snap_participants', 'depth_chart_changes', 'depth_chart_entries', 'grading_schemes']) {
    await db.schema.dropTable(table).ifExists().cascade().execute();
  }
}
