import { DEFAULT_TAG_LISTS } from '@shared/film';
import { DEFAULT_MISSED_REASONS, DEFAULT_PENALTY_TYPES } from '@shared/grading';
import type { DatabaseHandle } from '../../db/database';
import { createTeamFixture, type TeamFixture } from '../../test/support/fixtures';
import { progress } from './bench-cli';

/**
 * A whole program's film for the benchmarks: several seasons of games and practices with grades,
 * in the shape db/seeds/film-and-grades.ts gives one season (starters on the field with a few
 * substitutions, grades by the position coach on every snap and by the coordinator on some, snaps
 * tagged with the team's concepts and fronts, skill that drifts week by week, weak concept × front
 * pairings), but written with generate_series in a handful of INSERT … SELECT statements, so a
 * million grade rows take seconds instead of the minutes the seed's batched inserts need.
 *
 * Roster: four linemen arrive each season and stay four years (16 a season). The depth chart ranks
 * each position by seniority; the first unit plays the games, all three units take practice reps.
 * Deterministic: every "random" choice is a hash of row ids (no random()).
 */
export interface ProgramShape {
  seasons: number;
  gamesPerSeason: number;
  snapsPerGame: [number, number];
  /** 20 camp practices, then four a week. */
  practicesPerSeason: number;
  repsPerPractice: number;
  coordinatorGameShare: number;
  coordinatorPracticeShare: number;
}

/** About a million grade rows: ten seasons × (12 games × ~65 snaps + 68 practices × 250 reps) × 5 linemen. */
export const FULL_PROGRAM: ProgramShape = {
  seasons: 10,
  gamesPerSeason: 12,
  snapsPerGame: [55, 75],
  practicesPerSeason: 68,
  repsPerPractice: 250,
  coordinatorGameShare: 0.4,
  coordinatorPracticeShare: 0.1,
};

/** The same ten seasons with thin practices: about 110 000 grade rows. */
export const QUICK_PROGRAM: ProgramShape = { ...FULL_PROGRAM, repsPerPractice: 15 };

export const LINE_POSITIONS = ['LT', 'LG', 'C', 'RG', 'RT'] as const;

export interface GeneratedProgram {
  team: TeamFixture;
  /** Oldest first; the last one is the fixture's current season. */
  seasons: { id: number; name: string }[];
  /** Rank-1 linemen of each season by position, LT to RT. */
  starters: Map<number, { playerId: number; position: string }[]>;
  counts: { sessions: number; snaps: number; participants: number; grades: number };
  seconds: number;
}

/** Names that are plainly made up: no real people. */
const FIRST = ['Arlo', 'Bram', 'Cade', 'Dorian', 'Emory', 'Fenn', 'Gideon', 'Hale', 'Ives', 'Jory', 'Kellan', 'Lorne', 'Merritt'];
const LAST = ['Anvilsworth', 'Blockridge', 'Castellane', 'Drayburn', 'Emberlin', 'Forgeham'];

/** Same as the seed's periods (db/seeds/film-and-grades.ts). */
const PERIODS = ['inside run', 'one-on-one pass protection', 'team run', 'team pass'];
const PERSONNEL = ['11', '11', '11', '12', '12', '21', '10', '13'];

export async function generateProgram(handle: DatabaseHandle, shape: ProgramShape, label = 'Bench'): Promise<GeneratedProgram> {
  const started = Date.now();
  const team = await createTeamFixture(handle.db, label);
  const client = await handle.pool.connect();
  try {
    // Bulk load: skip the foreign-key triggers for this connection (every id below is made from
    // rows just inserted). Needs a superuser, which the benchmark's own cluster has.
    await client.query(`SET session_replication_role = replica`).catch(() => progress('not a superuser: loading with foreign-key checks'));
    await client.query(`SET synchronous_commit = off`);
    // h(key, salt) in [0, 1): a stable hash, so the same rows come out on every run.
    await client.query(`CREATE FUNCTION pg_temp.h(k bigint, salt int) RETURNS float8 LANGUAGE sql IMMUTABLE PARALLEL SAFE
      AS $$ SELECT (hashint8(k * 1000003 + salt) & 2147483647)::float8 / 2147483648 $$`);

    const currentYear = 2026;
    const seasons: { id: number; name: string; year: number }[] = [];
    for (let k = 0; k < shape.seasons - 1; k += 1) {
      const year = currentYear - (shape.seasons - 1) + k;
      const row = await client.query<{ id: string }>(
        `INSERT INTO seasons (team_id, name, starts_on, ends_on, is_current) VALUES ($1, $2, $3, $4, false) RETURNING id`,
        [team.teamId, String(year), `${year}-08-01`, `${year}-12-15`],
      );
      seasons.push({ id: Number(row.rows[0]!.id), name: String(year), year });
    }
    seasons.push({ id: team.seasonId, name: String(currentYear), year: currentYear });

    await client.query(
      `INSERT INTO tag_list_items (team_id, kind, name, sort_order)
       SELECT $1::bigint, l.kind, t.name, t.ord - 1
       FROM jsonb_each($2::jsonb) AS l(kind, names) CROSS JOIN LATERAL jsonb_array_elements_text(l.names) WITH ORDINALITY AS t(name, ord)
       ON CONFLICT DO NOTHING`,
      [team.teamId, JSON.stringify(DEFAULT_TAG_LISTS)],
    );
    const tags = await client.query<{ id: string; kind: string }>(`SELECT id, kind FROM tag_list_items WHERE team_id = $1 ORDER BY kind, sort_order`, [team.teamId]);
    const tagIds = (kind: string) => tags.rows.filter((t) => t.kind === kind).map((t) => Number(t.id));

    // Players: class c arrives in season c (c < 0: already on the team when the first season starts).
    const classes = Array.from({ length: shape.seasons + 3 }, (_, i) => i - 3);
    const players: { id: number; entry: number; index: number; position: string }[] = [];
    for (const c of classes) {
      for (let i = 0; i < 4; i += 1) {
        const index = (c + 3) * 4 + i;
        const name = `${FIRST[index % FIRST.length]} ${LAST[Math.floor(index / FIRST.length) % LAST.length]} ${index + 1}`;
        const row = await client.query<{ id: string }>(`INSERT INTO players (team_id, name) VALUES ($1, $2) RETURNING id`, [team.teamId, name]);
        players.push({ id: Number(row.rows[0]!.id), entry: c, index, position: LINE_POSITIONS[index % 5]! });
      }
    }
    const starters = new Map<number, { playerId: number; position: string }[]>();
    for (const [k, season] of seasons.entries()) {
      const roster = players.filter((p) => p.entry <= k && k <= p.entry + 3);
      for (const p of roster) {
        const year = k - p.entry;
        await client.query(
          `INSERT INTO roster_entries (season_id, player_id, jersey, positions, class_year, height_in, weight_lb) VALUES ($1, $2, $3, $4, $5, $6, $7)`,
          [season.id, p.id, 50 + (p.index % 16), [p.position], ['Fr', 'So', 'Jr', 'Sr'][year], 74 + (p.index % 5), 270 + (p.index % 9) * 5],
        );
      }
      // Depth chart: the oldest at each spot starts; ties by arrival order.
      for (const position of LINE_POSITIONS) {
        const ranked = roster.filter((p) => p.position === position).sort((a, b) => a.entry - b.entry || a.index - b.index);
        for (const [r, p] of ranked.entries()) {
          await client.query(`INSERT INTO depth_chart_entries (season_id, position, rank, player_id) VALUES ($1, $2, $3, $4)`, [season.id, position, r + 1, p.id]);
        }
        if (ranked.length < 3) throw new Error(`season ${season.name}: only ${ranked.length} linemen at ${position}`);
      }
      starters.set(
        season.id,
        LINE_POSITIONS.map((position) => ({ position, playerId: roster.filter((p) => p.position === position).sort((a, b) => a.entry - b.entry || a.index - b.index)[0]!.id })),
      );
    }
    // Skill per player: a base plus rate, a weekly drift and a little growth each year in the program.
    await client.query(`CREATE TEMP TABLE program_skill (player_id bigint PRIMARY KEY, base float8, hands float8, pad float8, drift float8)`);
    await client.query(
      `INSERT INTO program_skill SELECT id, 0.62 + pg_temp.h(id, 1) * 0.26, -0.04 + pg_temp.h(id, 2) * 0.08, -0.08 + pg_temp.h(id, 3) * 0.1, (pg_temp.h(id, 4) - 0.35) * 0.02
       FROM players WHERE team_id = $1`,
      [team.teamId],
    );

    const seasonIds = seasons.map((s) => s.id);
    // The first game on the first Friday of September.
    const firstGames = seasons.map((s) => firstFridayOfSeptember(s.year));
    const [minSnaps, maxSnaps] = shape.snapsPerGame;
    const camp = Math.min(20, shape.practicesPerSeason);
    const sessions = await client.query(
      `INSERT INTO film_sessions (team_id, season_id, kind, title, date, opponent, home_away, week, periods, created_by)
       SELECT $1::bigint, s.id, 'game', 'Week ' || w || ' vs Opponent ' || w, s.first_game + (w - 1) * 7, 'Opponent ' || w,
              CASE WHEN w % 2 = 1 THEN 'home' ELSE 'away' END, w, '{}'::text[], $2::bigint
       FROM unnest($3::bigint[], $4::date[]) AS s(id, first_game), generate_series(1, $5::int) AS w
       UNION ALL
       SELECT $1::bigint, s.id, 'practice',
              CASE WHEN p <= $6 THEN 'Camp practice ' || p ELSE 'Week ' || (1 + (p - $6 - 1) / 4) || ' practice ' || (1 + (p - $6 - 1) % 4) END,
              CASE WHEN p <= $6 THEN s.first_game - 30 + p ELSE s.first_game + ((p - $6 - 1) / 4) * 7 - 4 + (p - $6 - 1) % 4 END,
              NULL, NULL, CASE WHEN p <= $6 THEN NULL ELSE 1 + (p - $6 - 1) / 4 END, $7::text[], $2::bigint
       FROM unnest($3::bigint[], $4::date[]) AS s(id, first_game), generate_series(1, $8::int) AS p`,
      [team.teamId, team.accounts.coach.userId, seasonIds, firstGames, shape.gamesPerSeason, camp, PERIODS, shape.practicesPerSeason],
    );

    const snaps = await client.query(
      `INSERT INTO snaps (session_id, "order", quarter, down, distance, yard_line, field_side, hash, personnel, formation_id, concept_id, direction, front_id, result_yards, outcome_id, period)
       SELECT fs.id, n,
              CASE WHEN fs.kind = 'game' THEN 1 + (4 * (n - 1)) / cnt END,
              dn, CASE WHEN dn = 1 THEN 10 ELSE 1 + floor(pg_temp.h(fs.id * 1000 + n, 12) * 12)::int END,
              1 + floor(pg_temp.h(fs.id * 1000 + n, 13) * 50)::int,
              CASE WHEN pg_temp.h(fs.id * 1000 + n, 14) < 0.55 THEN 'own' ELSE 'opp' END,
              (ARRAY['left', 'middle', 'right'])[1 + floor(pg_temp.h(fs.id * 1000 + n, 15) * 3)::int],
              ($4::text[])[1 + floor(pg_temp.h(fs.id * 1000 + n, 16) * cardinality($4::text[]))::int],
              ($5::bigint[])[1 + floor(pg_temp.h(fs.id * 1000 + n, 17) * cardinality($5::bigint[]))::int],
              ($6::bigint[])[1 + floor(pg_temp.h(fs.id * 1000 + n, 18) * cardinality($6::bigint[]))::int],
              (ARRAY['left', 'middle', 'right'])[1 + floor(pg_temp.h(fs.id * 1000 + n, 19) * 3)::int],
              ($7::bigint[])[1 + floor(pg_temp.h(fs.id * 1000 + n, 20) * cardinality($7::bigint[]))::int],
              round((pg_temp.h(fs.id * 1000 + n, 21) - 0.25) * 14)::int,
              ($8::bigint[])[1 + floor(pg_temp.h(fs.id * 1000 + n, 22) * cardinality($8::bigint[]))::int],
              CASE WHEN fs.kind = 'practice' THEN fs.periods[1 + floor(pg_temp.h(fs.id * 1000 + n, 23) * cardinality(fs.periods))::int] END
       FROM film_sessions fs
       CROSS JOIN LATERAL (SELECT CASE WHEN fs.kind = 'game' THEN $2::int + floor(pg_temp.h(fs.id, 10) * ($3::int - $2::int + 1))::int ELSE $9::int END AS cnt) c
       CROSS JOIN LATERAL generate_series(1, c.cnt) AS n
       CROSS JOIN LATERAL (SELECT 1 + floor(pg_temp.h(fs.id * 1000 + n, 11) * 3.4)::int AS dn) d
       WHERE fs.team_id = $1`,
      [team.teamId, minSnaps, maxSnaps, PERSONNEL, tagIds('formation'), tagIds('concept'), tagIds('front'), tagIds('outcome'), shape.repsPerPractice],
    );

    // Who is on the field: games the first unit (a backup now and then at one spot), practices one
    // of the three units (first 50 %, second 30 %, third 20 %).
    await client.query(
      `CREATE TEMP TABLE program_field AS
       SELECT s.id AS snap_id, s.session_id, fs.kind, coalesce(fs.week, 0) AS week, fs.date, s.concept_id, s.front_id, s."order", pos.position, pos.idx, d.player_id,
              (d.rank <> 1) AS substitute
       FROM snaps s JOIN film_sessions fs ON fs.id = s.session_id
       CROSS JOIN (VALUES ('LT', 1), ('LG', 2), ('C', 3), ('RG', 4), ('RT', 5)) AS pos(position, idx)
       CROSS JOIN LATERAL (SELECT CASE WHEN fs.kind = 'game' THEN CASE WHEN pg_temp.h(s.id * 8 + pos.idx, 30) < 0.08 THEN 2 ELSE 1 END
                                       ELSE CASE WHEN pg_temp.h(s.id, 31) < 0.5 THEN 1 WHEN pg_temp.h(s.id, 31) < 0.8 THEN 2 ELSE 3 END END AS rank) r
       JOIN depth_chart_entries d ON d.season_id = fs.season_id AND d.position = pos.position AND d.rank = r.rank
       WHERE fs.team_id = $1`,
      [team.teamId],
    );
    const participants = await client.query(
      `INSERT INTO snap_participants (snap_id, player_id, position)
       SELECT f.snap_id, f.player_id, f.position FROM program_field f
       WHERE f.snap_id IN (SELECT snap_id FROM program_field WHERE substitute)`,
    );

    // The coach grades every snap; the coordinator some, agreeing mostly (hands and pad level seen
    // the other way 12 % of the time). Strict result rule: plus when the assignment is right, no
    // technique mark is minus and there is no loaf.
    const grades = await client.query(
      `INSERT INTO grades (snap_id, player_id, grader_id, scheme_version, position, assignment, missed_reason, footwork, hands, pad_level, effort,
                           knockdowns, pressures_allowed, sacks_allowed, penalties, penalty_count, result, created_at, updated_at)
       SELECT m.snap_id, m.player_id, m.grader_id, 1, m.position, m.assignment,
              CASE WHEN m.assignment = 'missed' THEN ($5::text[])[1 + floor(pg_temp.h(m.k, 60) * 4)::int] END,
              m.footwork, m.hands, m.pad_level, m.effort,
              (pg_temp.h(m.k, 61) < 0.12)::int, (pg_temp.h(m.k, 62) < 0.04)::int, (pg_temp.h(m.k, 63) < 0.008)::int,
              CASE WHEN pg_temp.h(m.k, 64) < 0.015 THEN jsonb_build_array(jsonb_build_object('type', ($6::text[])[1 + floor(pg_temp.h(m.k, 65) * 2)::int])) ELSE '[]'::jsonb END,
              (pg_temp.h(m.k, 64) < 0.015)::int,
              CASE WHEN m.assignment = 'missed' OR m.effort = 'loaf' OR 'minus' IN (m.footwork, m.hands, m.pad_level) THEN 'minus' ELSE 'plus' END,
              m.at, m.at
       FROM (
         SELECT f.snap_id, f.player_id, f.position, gr.grader_id, f.snap_id * 16 + f.idx + gr.second * 8 AS k,
                f.date + time '21:00' + make_interval(days => 1 + gr.second, secs => f."order") AS at,
                CASE WHEN pg_temp.h(t.k, 40) < least(0.97, sk.base + 0.1) + t.bonus THEN 'right' ELSE 'missed' END AS assignment,
                CASE WHEN pg_temp.h(t.k, 41) < greatest(0.05, least(0.99, sk.base + t.bonus)) THEN 'plus' ELSE 'minus' END AS footwork,
                CASE WHEN (pg_temp.h(t.k, 42) < greatest(0.05, least(0.99, sk.base + sk.hands + t.bonus))) <> (gr.second = 1 AND pg_temp.h(t.k, 50) < 0.12) THEN 'plus' ELSE 'minus' END AS hands,
                CASE WHEN (pg_temp.h(t.k, 43) < greatest(0.05, least(0.99, sk.base + sk.pad + t.bonus))) <> (gr.second = 1 AND pg_temp.h(t.k, 51) < 0.12) THEN 'plus' ELSE 'minus' END AS pad_level,
                CASE WHEN pg_temp.h(t.k, 44) < 0.01 THEN 'loaf' WHEN pg_temp.h(t.k, 45) < greatest(0.05, least(0.99, least(0.98, sk.base + 0.12) + t.bonus)) THEN 'plus' ELSE 'minus' END AS effort
         FROM program_field f
         JOIN program_skill sk ON sk.player_id = f.player_id
         CROSS JOIN LATERAL (SELECT f.snap_id * 8 + f.idx AS k,
                                    CASE WHEN pg_temp.h(f.concept_id * 1000 + f.front_id, 32) < 0.2 THEN -0.15 ELSE pg_temp.h(f.concept_id * 1000 + f.front_id, 33) * 0.05 END
                                    + sk.drift * f.week + CASE WHEN f.kind = 'practice' THEN 0.03 ELSE 0 END AS bonus) t
         CROSS JOIN LATERAL (VALUES ($1::bigint, 0), ($2::bigint, 1)) AS gr(grader_id, second)
         WHERE gr.second = 0 OR pg_temp.h(f.snap_id, 34) < CASE WHEN f.kind = 'game' THEN $3::float8 ELSE $4::float8 END
       ) m`,
      [team.accounts.coach.userId, team.accounts.coordinator.userId, shape.coordinatorGameShare, shape.coordinatorPracticeShare, DEFAULT_MISSED_REASONS, DEFAULT_PENALTY_TYPES],
    );
    await client.query(`RESET session_replication_role`);
    await client.query(`DROP TABLE program_field; DROP TABLE program_skill`);
    // Fresh statistics and visibility map, as autovacuum would leave a database that has grown over years.
    for (const table of ['film_sessions', 'snaps', 'snap_participants', 'grades', 'players', 'depth_chart_entries', 'memberships', 'tag_list_items', 'seasons']) {
      await client.query(`VACUUM (ANALYZE) ${table}`);
    }
    const counts = { sessions: sessions.rowCount ?? 0, snaps: snaps.rowCount ?? 0, participants: participants.rowCount ?? 0, grades: grades.rowCount ?? 0 };
    const seconds = (Date.now() - started) / 1000;
    progress(`program: ${shape.seasons} seasons, ${counts.sessions} sessions, ${counts.snaps} snaps, ${counts.grades} grades in ${seconds.toFixed(1)} s`);
    return { team, seasons: seasons.map(({ id, name }) => ({ id, name })), starters, counts, seconds };
  } finally {
    client.release(true);
  }
}

function firstFridayOfSeptember(year: number): string {
  const d = new Date(Date.UTC(year, 8, 1));
  while (d.getUTCDay() !== 5) d.setUTCDate(d.getUTCDate() + 1);
  return d.toISOString().slice(0, 10);
}
