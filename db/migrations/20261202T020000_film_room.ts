import { type Kysely, sql } from 'kysely';

// The player film room: comments on clips (coaching points for players, players' questions, and
// replies), who each point is for and whether he acknowledged it, how much of each clip a player
// watched, cut-ups (playlists) shared with players or position groups, and mail preferences.
// Frozen in time: never import application code here.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('clip_comments')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('team_id', 'bigint', (c) => c.notNull().references('teams.id').onDelete('cascade'))
    .addColumn('clip_id', 'bigint', (c) => c.notNull().references('clips.id').onDelete('cascade'))
    .addColumn('parent_id', 'bigint', (c) => c.references('clip_comments.id').onDelete('cascade'))
    .addColumn('author_id', 'bigint', (c) => c.notNull().references('users.id'))
    .addColumn('at_ms', 'integer', (c) => c.notNull().check(sql`at_ms >= 0`))
    .addColumn('end_ms', 'integer')
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind IN ('praise','correction','teaching','question','reply')`))
    .addColumn('component', 'text')
    .addColumn('body', 'text', (c) => c.notNull())
    .addColumn('hidden_at', 'timestamptz')
    .addColumn('hidden_by', 'bigint', (c) => c.references('users.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('clip_comments_clip_idx').on('clip_comments').columns(['clip_id', 'at_ms']).execute();
  await db.schema.createIndex('clip_comments_parent_idx').on('clip_comments').column('parent_id').execute();

  await db.schema
    .createTable('comment_revisions')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('comment_id', 'bigint', (c) => c.notNull().references('clip_comments.id').onDelete('cascade'))
    .addColumn('body', 'text', (c) => c.notNull())
    .addColumn('edited_by', 'bigint', (c) => c.references('users.id'))
    .addColumn('edited_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable('comment_targets')
    .addColumn('comment_id', 'bigint', (c) => c.notNull().references('clip_comments.id').onDelete('cascade'))
    .addColumn('player_id', 'bigint', (c) => c.notNull().references('players.id').onDelete('cascade'))
    .addColumn('acknowledged_at', 'timestamptz')
    .addColumn('digested_at', 'timestamptz')
    .addPrimaryKeyConstraint('comment_targets_pk', ['comment_id', 'player_id'])
    .execute();
  await db.schema.createIndex('comment_targets_player_idx').on('comment_targets').columns(['player_id', 'comment_id']).execute();

  await db.schema
    .createTable('clip_views')
    .addColumn('clip_id', 'bigint', (c) => c.notNull().references('clips.id').onDelete('cascade'))
    .addColumn('player_id', 'bigint', (c) => c.notNull().references('players.id').onDelete('cascade'))
    .addColumn('ranges', 'jsonb', (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn('watched_ms', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('last_seen_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint('clip_views_pk', ['clip_id', 'player_id'])
    .execute();

  await db.schema
    .createTable('cutups')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('team_id', 'bigint', (c) => c.notNull().references('teams.id').onDelete('cascade'))
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('description', 'text')
    .addColumn('filter', 'jsonb')
    .addColumn('created_by', 'bigint', (c) => c.references('users.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema
    .createTable('cutup_items')
    .addColumn('cutup_id', 'bigint', (c) => c.notNull().references('cutups.id').onDelete('cascade'))
    .addColumn('position', 'integer', (c) => c.notNull())
    .addColumn('clip_id', 'bigint', (c) => c.notNull().references('clips.id').onDelete('cascade'))
    .addColumn('note', 'text')
    .addPrimaryKeyConstraint('cutup_items_pk', ['cutup_id', 'position'])
    .execute();
  // Shared with one player, or with a position group (OL, TE, or one spot such as RG).
  await db.schema
    .createTable('cutup_shares')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('cutup_id', 'bigint', (c) => c.notNull().references('cutups.id').onDelete('cascade'))
    .addColumn('player_id', 'bigint', (c) => c.references('players.id').onDelete('cascade'))
    .addColumn('position_group', 'text', (c) => c.check(sql`position_group IN ('OL','TE','LT','LG','C','RG','RT')`))
    .addCheckConstraint('cutup_shares_one_target', sql`(player_id IS NULL) <> (position_group IS NULL)`)
    .execute();

  await db.schema
    .createTable('mail_preferences')
    .addColumn('user_id', 'bigint', (c) => c.primaryKey().references('users.id').onDelete('cascade'))
    .addColumn('coaching_digest', 'boolean', (c) => c.notNull().defaultTo(true))
    .addColumn('digest_every_hours', 'smallint', (c) => c.notNull().defaultTo(1).check(sql`digest_every_hours IN (1, 3, 24)`))
    .addColumn('weekly_summary', 'boolean', (c) => c.notNull().defaultTo(true))
    .addColumn('unsubscribe_token_hash', 'text', (c) => c.unique())
    .addColumn('last_digest_at', 'timestamptz')
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ['mail_preferences', 'cutup_shares', 'cutup_items', 'cutups', 'clip_views', 'comment_targets', 'comment_revisions', 'clip_comments']) {
    await db.schema.dropTable(table).ifExists().cascade().execute();
  }
}
