import { type Kysely, sql } from 'kysely';

// Foundation: accounts, teams, seasons, memberships, roster, invitations, password resets,
// the session store and the sign-in throttle. Frozen in time: never import application code here.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`CREATE EXTENSION IF NOT EXISTS citext`.execute(db);

  await db.schema
    .createTable('users')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('email', sql`citext`, (c) => c.notNull().unique())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('password_hash', 'text')
    .addColumn('active', 'boolean', (c) => c.notNull().defaultTo(true))
    .addColumn('password_changed_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable('teams')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable('seasons')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('team_id', 'bigint', (c) => c.notNull().references('teams.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('starts_on', 'date', (c) => c.notNull())
    .addColumn('ends_on', 'date', (c) => c.notNull())
    .addColumn('is_current', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('seasons_team_name_unique', ['team_id', 'name'])
    .execute();
  // At most one current season per team.
  await sql`CREATE UNIQUE INDEX seasons_one_current ON seasons (team_id) WHERE is_current`.execute(db);

  // A player is a person on the team across seasons; roster_entries hold the per-season facts.
  await db.schema
    .createTable('players')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('team_id', 'bigint', (c) => c.notNull().references('teams.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('players_team_idx').on('players').column('team_id').execute();

  await db.schema
    .createTable('roster_entries')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('season_id', 'bigint', (c) => c.notNull().references('seasons.id').onDelete('cascade'))
    .addColumn('player_id', 'bigint', (c) => c.notNull().references('players.id').onDelete('cascade'))
    .addColumn('jersey', 'smallint', (c) => c.notNull().check(sql`jersey BETWEEN 0 AND 99`))
    .addColumn('positions', sql`text[]`, (c) => c.notNull())
    .addColumn('class_year', 'text', (c) => c.notNull().check(sql`class_year IN ('Fr','So','Jr','Sr','Gr')`))
    .addColumn('redshirt', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('height_in', 'smallint')
    .addColumn('weight_lb', 'smallint')
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('active').check(sql`status IN ('active','injured','inactive')`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('roster_entries_season_player_unique', ['season_id', 'player_id'])
    .execute();
  // Deferrable so that an import can swap two players' numbers inside one transaction.
  await sql`ALTER TABLE roster_entries ADD CONSTRAINT roster_entries_season_jersey_unique
    UNIQUE (season_id, jersey) DEFERRABLE INITIALLY IMMEDIATE`.execute(db);

  await db.schema
    .createTable('memberships')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('user_id', 'bigint', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('team_id', 'bigint', (c) => c.notNull().references('teams.id').onDelete('cascade'))
    .addColumn('role', 'text', (c) => c.notNull().check(sql`role IN ('admin','coordinator','coach','analyst','player')`))
    .addColumn('player_id', 'bigint', (c) => c.references('players.id').onDelete('set null'))
    .addColumn('active', 'boolean', (c) => c.notNull().defaultTo(true))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('memberships_user_team_unique', ['user_id', 'team_id'])
    .execute();
  await sql`CREATE UNIQUE INDEX memberships_one_account_per_player ON memberships (player_id) WHERE player_id IS NOT NULL`.execute(db);
  await db.schema.createIndex('memberships_team_idx').on('memberships').column('team_id').execute();

  await db.schema
    .createTable('invitations')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('team_id', 'bigint', (c) => c.notNull().references('teams.id').onDelete('cascade'))
    .addColumn('email', sql`citext`, (c) => c.notNull())
    .addColumn('role', 'text', (c) => c.notNull().check(sql`role IN ('admin','coordinator','coach','analyst','player')`))
    .addColumn('player_id', 'bigint', (c) => c.references('players.id').onDelete('cascade'))
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('invited_by', 'bigint', (c) => c.notNull().references('users.id'))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('last_sent_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('accepted_at', 'timestamptz')
    .addColumn('revoked_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await sql`CREATE UNIQUE INDEX invitations_one_pending ON invitations (team_id, email) WHERE accepted_at IS NULL AND revoked_at IS NULL`.execute(db);

  await db.schema
    .createTable('password_resets')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('user_id', 'bigint', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('used_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  // connect-pg-simple's table (its own table.sql), with a user_id column so that a password change
  // or deactivation can end a user's other sessions.
  await sql`
    CREATE TABLE "session" (
      "sid" varchar NOT NULL COLLATE "default" PRIMARY KEY,
      "sess" json NOT NULL,
      "expire" timestamp(6) NOT NULL
    )`.execute(db);
  await sql`CREATE INDEX "IDX_session_expire" ON "session" ("expire")`.execute(db);
  await sql`CREATE INDEX "IDX_session_user" ON "session" ((("sess"->'passport'->>'user')))`.execute(db);

  // rate-limiter-flexible's Postgres store (we create it so the app never runs DDL at runtime).
  await sql`
    CREATE TABLE "rate_limits" (
      "key" varchar(255) PRIMARY KEY,
      "points" integer NOT NULL DEFAULT 0,
      "expire" bigint
    )`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ['rate_limits', 'session', 'password_resets', 'invitations', 'memberships', 'roster_entries', 'players', 'seasons', 'teams', 'users']) {
    await db.schema.dropTable(table).ifExists().cascade().execute();
  }
}
