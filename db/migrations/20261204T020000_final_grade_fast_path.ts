import { type Kysely, sql } from 'kysely';

// The final-grade flag (20261204T000000_final_grade_flag) at the cost of a plain insert in the
// common case: a coach grading a cell nobody has graded yet. Measured with pgbench on this project's
// 2-core machine (single inserts, 4 clients): no triggers 8 300/s; the flag as first written 1 550/s;
// with this fast path 6 400/s.
//   - BEFORE INSERT, per row: a grade is guessed final when its cell has no grade yet, so the first
//     grade of a cell is written once (before, it was written as false and then flipped: a second row
//     version with all its index entries).
//   - The statement trigger still takes the cells' row locks, and then ranks only when some inserted
//     cell holds more than one grade or a grade not flagged final. A guess is thereby always checked
//     under the lock against every committed grade: two coaches grading the same cell at the same
//     moment both guess true, and the one that locks second sees two grades and ranks the cell.
// The rule itself still lives only in final_grade_rank_refresh(). Frozen in time: never import
// application code here.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    CREATE FUNCTION final_grade_first_guess() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      NEW.is_final := NOT EXISTS (SELECT 1 FROM grades g WHERE g.snap_id = NEW.snap_id AND g.player_id = NEW.player_id);
      RETURN NEW;
    END $$`.execute(db);
  await sql`
    CREATE TRIGGER grades_final_first_guess BEFORE INSERT ON grades
    FOR EACH ROW EXECUTE FUNCTION final_grade_first_guess()`.execute(db);

  await sql`
    CREATE OR REPLACE FUNCTION final_grade_on_grades_inserted() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE snaps_ bigint[]; players_ bigint[];
    BEGIN
      SELECT array_agg(snap_id), array_agg(player_id) INTO snaps_, players_ FROM inserted_grades;
      IF snaps_ IS NULL THEN RETURN NULL; END IF;
      PERFORM 1 FROM snaps WHERE id = ANY(snaps_) ORDER BY id FOR NO KEY UPDATE;
      -- Under the locks, with every committed grade in view: a cell holding just one grade, flagged
      -- final, is right as it is.
      IF NOT EXISTS (
        SELECT 1 FROM (SELECT DISTINCT snap_id, player_id FROM inserted_grades) c
        JOIN grades g ON g.snap_id = c.snap_id AND g.player_id = c.player_id
        GROUP BY c.snap_id, c.player_id
        HAVING count(*) <> 1 OR NOT bool_and(g.is_final)
      ) THEN
        RETURN NULL;
      END IF;
      PERFORM final_grade_rank_refresh(snaps_, players_);
      RETURN NULL;
    END $$`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`DROP TRIGGER grades_final_first_guess ON grades`.execute(db);
  await sql`DROP FUNCTION final_grade_first_guess()`.execute(db);
  await sql`
    CREATE OR REPLACE FUNCTION final_grade_on_grades_inserted() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM final_grade_rank_refresh(array_agg(snap_id), array_agg(player_id)) FROM inserted_grades;
      RETURN NULL;
    END $$`.execute(db);
}
