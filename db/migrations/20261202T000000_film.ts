import { type Kysely, sql } from 'kysely';

// Film: sessions (game, scrimmage, practice), snaps with their play data, clips (one angle of a snap,
// or a continuous tape), and each team's tag lists. Frozen in time: never import application code here.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('tag_list_items')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('team_id', 'bigint', (c) => c.notNull().references('teams.id').onDelete('cascade'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind IN ('formation','concept','front','outcome')`))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('active', 'boolean', (c) => c.notNull().defaultTo(true))
    .addColumn('sort_order', 'integer', (c) => c.notNull().defaultTo(0))
    .addUniqueConstraint('tag_list_items_unique', ['team_id', 'kind', 'name'])
    .execute();

  await db.schema
    .createTable('film_sessions')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('team_id', 'bigint', (c) => c.notNull().references('teams.id').onDelete('cascade'))
    .addColumn('season_id', 'bigint', (c) => c.notNull().references('seasons.id').onDelete('cascade'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind IN ('game','scrimmage','practice')`))
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('date', 'date', (c) => c.notNull())
    .addColumn('opponent', 'text')
    .addColumn('home_away', 'text', (c) => c.check(sql`home_away IN ('home','away','neutral')`))
    .addColumn('week', 'smallint')
    .addColumn('periods', sql`text[]`, (c) => c.notNull().defaultTo(sql`'{}'::text[]`))
    .addColumn('created_by', 'bigint', (c) => c.references('users.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('film_sessions_team_season_idx').on('film_sessions').columns(['team_id', 'season_id', 'date']).execute();

  await db.schema
    .createTable('snaps')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('session_id', 'bigint', (c) => c.notNull().references('film_sessions.id').onDelete('cascade'))
    .addColumn('order', 'integer', (c) => c.notNull())
    .addColumn('quarter', 'smallint', (c) => c.check(sql`quarter BETWEEN 1 AND 5`))
    .addColumn('down', 'smallint', (c) => c.check(sql`down BETWEEN 1 AND 4`))
    .addColumn('distance', 'smallint', (c) => c.check(sql`distance BETWEEN 0 AND 99`))
    .addColumn('yard_line', 'smallint', (c) => c.check(sql`yard_line BETWEEN 1 AND 50`))
    .addColumn('field_side', 'text', (c) => c.check(sql`field_side IN ('own','opp')`))
    .addColumn('hash', 'text', (c) => c.check(sql`hash IN ('left','middle','right')`))
    .addColumn('personnel', 'text', (c) => c.check(sql`personnel ~ '^[0-5][0-5]$'`))
    .addColumn('formation_id', 'bigint', (c) => c.references('tag_list_items.id'))
    .addColumn('concept_id', 'bigint', (c) => c.references('tag_list_items.id'))
    .addColumn('direction', 'text', (c) => c.check(sql`direction IN ('left','middle','right')`))
    .addColumn('front_id', 'bigint', (c) => c.references('tag_list_items.id'))
    .addColumn('result_yards', 'smallint', (c) => c.check(sql`result_yards BETWEEN -99 AND 99`))
    .addColumn('outcome_id', 'bigint', (c) => c.references('tag_list_items.id'))
    .addColumn('period', 'text')
    .addColumn('notes', 'text')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  // Deferrable so that snaps can be renumbered in one transaction.
  await sql`ALTER TABLE snaps ADD CONSTRAINT snaps_session_order_unique UNIQUE (session_id, "order") DEFERRABLE INITIALLY IMMEDIATE`.execute(db);

  await db.schema
    .createTable('clips')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('team_id', 'bigint', (c) => c.notNull().references('teams.id').onDelete('cascade'))
    .addColumn('session_id', 'bigint', (c) => c.notNull().references('film_sessions.id').onDelete('cascade'))
    .addColumn('snap_id', 'bigint', (c) => c.references('snaps.id').onDelete('set null'))
    .addColumn('kind', 'text', (c) => c.notNull().defaultTo('snap').check(sql`kind IN ('snap','tape')`))
    .addColumn('angle', 'text', (c) => c.notNull().defaultTo('sideline').check(sql`angle IN ('sideline','end_zone','other')`))
    .addColumn('upload_order', 'integer', (c) => c.notNull())
    .addColumn('original_name', 'text', (c) => c.notNull())
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('received').check(sql`status IN ('received','processing','ready','failed')`))
    .addColumn('failure_reason', 'text')
    .addColumn('progress', 'smallint', (c) => c.notNull().defaultTo(0))
    .addColumn('sha256', 'text')
    .addColumn('size_bytes', 'bigint')
    .addColumn('original_key', 'text')
    .addColumn('poster_key', 'text')
    .addColumn('strip_key', 'text')
    .addColumn('strip', 'jsonb')
    .addColumn('rendition_key', 'text')
    .addColumn('duration_ms', 'integer')
    .addColumn('width', 'integer')
    .addColumn('height', 'integer')
    .addColumn('fps', sql`numeric(8, 3)`)
    .addColumn('video_codec', 'text')
    .addColumn('audio_codec', 'text')
    .addColumn('rotation', 'smallint')
    .addColumn('source_clip_id', 'bigint', (c) => c.references('clips.id').onDelete('set null'))
    .addColumn('source_start_ms', 'integer')
    .addColumn('source_end_ms', 'integer')
    .addColumn('proposed_cuts', 'jsonb')
    .addColumn('created_by', 'bigint', (c) => c.references('users.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('clips_session_idx').on('clips').columns(['session_id', 'upload_order']).execute();
  await db.schema.createIndex('clips_snap_idx').on('clips').column('snap_id').execute();
  // The same file twice in one session is refused (by content hash, not by name).
  await sql`CREATE UNIQUE INDEX clips_session_sha_unique ON clips (session_id, sha256) WHERE sha256 IS NOT NULL AND source_clip_id IS NULL`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ['clips', 'snaps', 'film_sessions', 'tag_list_items']) {
    await db.schema.dropTable(table).ifExists().cascade().execute();
  }
}
