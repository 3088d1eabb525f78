import { type Kysely, sql } from 'kysely';

// The final-grade rule, kept current on write instead of ranked on every read. Until now the
// final_grades view ranked every grade of a team (DISTINCT ON over a join with the scheme and the
// memberships) before a report could filter it, so a season's readiness grid on ten seasons of
// grades took seconds. Now each grade carries `is_final`, set by triggers whenever something the
// rule depends on changes:
//   - grades inserted or deleted (statement triggers with transition tables: a bulk insert ranks
//     once), or a grade's snap, player, grader or creation time changed;
//   - a grader's role in the team (memberships);
//   - the team's designated grader role (a new scheme version that changes it).
// The rule itself lives once, in final_grade_rank_refresh(): where several coaches graded the same
// player on the same snap, the grade of a coach holding the designated role counts (default the
// coordinator); otherwise the earliest grade (then the lowest id). The view keeps its name and
// columns (plus is_final), so the reports read final_grades as before.
// Frozen in time: never import application code here.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('grades').addColumn('is_final', 'boolean', (c) => c.notNull().defaultTo(false)).execute();

  await sql`
    CREATE FUNCTION final_grade_rank_refresh(p_snaps bigint[], p_players bigint[]) RETURNS void
    LANGUAGE plpgsql AS $$
    BEGIN
      IF p_snaps IS NULL OR cardinality(p_snaps) = 0 THEN RETURN; END IF;
      -- Writers of grades on the same snaps take turns (row locks, in id order so two never wait on
      -- each other): whoever ranks last sees every committed grade of those snaps, so two coaches
      -- saving the same cell at once cannot both end up final. FOR NO KEY UPDATE does not block the
      -- foreign-key checks of other grade inserts.
      PERFORM 1 FROM snaps WHERE id = ANY(p_snaps) ORDER BY id FOR NO KEY UPDATE;
      WITH pairs AS (
        SELECT DISTINCT p.snap_id, p.player_id FROM unnest(p_snaps, p_players) AS p(snap_id, player_id)
      ), ranked AS (
        SELECT g.id,
               row_number() OVER (
                 PARTITION BY g.snap_id, g.player_id
                 ORDER BY (m.role IS NOT DISTINCT FROM coalesce(scheme.designated_grader_role, 'coordinator')) DESC, g.created_at, g.id
               ) = 1 AS final
        FROM pairs p
        JOIN grades g ON g.snap_id = p.snap_id AND g.player_id = p.player_id
        JOIN snaps s ON s.id = g.snap_id
        JOIN film_sessions fs ON fs.id = s.session_id
        LEFT JOIN LATERAL (
          SELECT gs.designated_grader_role FROM grading_schemes gs
          WHERE gs.team_id = fs.team_id ORDER BY gs.version DESC LIMIT 1
        ) scheme ON true
        LEFT JOIN memberships m ON m.user_id = g.grader_id AND m.team_id = fs.team_id
      )
      UPDATE grades g SET is_final = r.final
      FROM ranked r
      WHERE g.id = r.id AND g.is_final IS DISTINCT FROM r.final;
    END $$`.execute(db);

  // Grades of one grader in one team, or of a whole team: the pairs whose ranking may change.
  await sql`
    CREATE FUNCTION final_grade_refresh_team(p_team bigint, p_grader bigint) RETURNS void
    LANGUAGE plpgsql AS $$
    DECLARE snaps_ bigint[]; players_ bigint[];
    BEGIN
      SELECT array_agg(g.snap_id), array_agg(g.player_id) INTO snaps_, players_
      FROM grades g JOIN snaps s ON s.id = g.snap_id JOIN film_sessions fs ON fs.id = s.session_id
      WHERE fs.team_id = p_team AND (p_grader IS NULL OR g.grader_id = p_grader);
      PERFORM final_grade_rank_refresh(snaps_, players_);
    END $$`.execute(db);

  await sql`
    CREATE FUNCTION final_grade_on_grades_inserted() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM final_grade_rank_refresh(array_agg(snap_id), array_agg(player_id)) FROM inserted_grades;
      RETURN NULL;
    END $$`.execute(db);
  await sql`
    CREATE TRIGGER grades_final_after_insert AFTER INSERT ON grades
    REFERENCING NEW TABLE AS inserted_grades FOR EACH STATEMENT EXECUTE FUNCTION final_grade_on_grades_inserted()`.execute(db);

  await sql`
    CREATE FUNCTION final_grade_on_grades_deleted() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM final_grade_rank_refresh(array_agg(snap_id), array_agg(player_id)) FROM deleted_grades;
      RETURN NULL;
    END $$`.execute(db);
  await sql`
    CREATE TRIGGER grades_final_after_delete AFTER DELETE ON grades
    REFERENCING OLD TABLE AS deleted_grades FOR EACH STATEMENT EXECUTE FUNCTION final_grade_on_grades_deleted()`.execute(db);

  // Editing marks (the everyday update) changes none of these columns and fires nothing.
  await sql`
    CREATE FUNCTION final_grade_on_grade_keys_updated() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM final_grade_rank_refresh(ARRAY[OLD.snap_id, NEW.snap_id], ARRAY[OLD.player_id, NEW.player_id]);
      RETURN NULL;
    END $$`.execute(db);
  await sql`
    CREATE TRIGGER grades_final_after_key_update AFTER UPDATE OF snap_id, player_id, grader_id, created_at ON grades
    FOR EACH ROW EXECUTE FUNCTION final_grade_on_grade_keys_updated()`.execute(db);

  await sql`
    CREATE FUNCTION final_grade_on_membership_changed() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP <> 'INSERT' THEN PERFORM final_grade_refresh_team(OLD.team_id, OLD.user_id); END IF;
      IF TG_OP <> 'DELETE' THEN PERFORM final_grade_refresh_team(NEW.team_id, NEW.user_id); END IF;
      RETURN NULL;
    END $$`.execute(db);
  await sql`
    CREATE TRIGGER memberships_final_grade AFTER INSERT OR DELETE OR UPDATE OF role, user_id, team_id ON memberships
    FOR EACH ROW EXECUTE FUNCTION final_grade_on_membership_changed()`.execute(db);

  // Only a change of the designated role re-ranks the team (saving other scheme rules does not).
  await sql`
    CREATE FUNCTION final_grade_on_scheme_changed() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE team_ bigint := coalesce(NEW.team_id, OLD.team_id); before_ text; after_ text;
    BEGIN
      SELECT designated_grader_role INTO after_ FROM grading_schemes WHERE team_id = team_ ORDER BY version DESC LIMIT 1;
      IF TG_OP = 'INSERT' THEN
        SELECT designated_grader_role INTO before_ FROM grading_schemes
        WHERE team_id = team_ AND version < NEW.version ORDER BY version DESC LIMIT 1;
        IF coalesce(before_, 'coordinator') = coalesce(after_, 'coordinator') THEN RETURN NULL; END IF;
      END IF;
      PERFORM final_grade_refresh_team(team_, NULL);
      RETURN NULL;
    END $$`.execute(db);
  await sql`
    CREATE TRIGGER grading_schemes_final_grade AFTER INSERT OR DELETE OR UPDATE OF designated_grader_role, version, team_id ON grading_schemes
    FOR EACH ROW EXECUTE FUNCTION final_grade_on_scheme_changed()`.execute(db);

  // Existing grades: rank them all once.
  await sql`SELECT final_grade_rank_refresh(array_agg(snap_id), array_agg(player_id)) FROM grades`.execute(db);

  await sql`DROP VIEW final_grades`.execute(db);
  await sql`
    CREATE VIEW final_grades AS
    SELECT g.*, s.session_id
    FROM grades g JOIN snaps s ON s.id = g.snap_id
    WHERE g.is_final`.execute(db);
  await sql`CREATE INDEX grades_final_snap_idx ON grades (snap_id) WHERE is_final`.execute(db);
  await sql`CREATE INDEX grades_final_player_idx ON grades (player_id, snap_id) WHERE is_final`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`DROP VIEW final_grades`.execute(db);
  await sql`DROP TRIGGER grading_schemes_final_grade ON grading_schemes`.execute(db);
  await sql`DROP TRIGGER memberships_final_grade ON memberships`.execute(db);
  await sql`DROP TRIGGER grades_final_after_key_update ON grades`.execute(db);
  await sql`DROP TRIGGER grades_final_after_delete ON grades`.execute(db);
  await sql`DROP TRIGGER grades_final_after_insert ON grades`.execute(db);
  for (const fn of [
    'final_grade_on_scheme_changed()',
    'final_grade_on_membership_changed()',
    'final_grade_on_grade_keys_updated()',
    'final_grade_on_grades_deleted()',
    'final_grade_on_grades_inserted()',
    'final_grade_refresh_team(bigint, bigint)',
    'final_grade_rank_refresh(bigint[], bigint[])',
  ]) {
    await sql.raw(`DROP FUNCTION ${fn}`).execute(db);
  }
  await db.schema.alterTable('grades').dropColumn('is_final').execute();
  // The view as it was (20261202T010000_grading).
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
