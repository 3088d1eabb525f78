/**
 * The development reports at program scale (issue 5 §4): player trend, candidate comparison and
 * readiness matrix through the API, each next to the same aggregate written by hand in SQL and run
 * through psql in the same script.
 *
 *   node --import tsx bench/development-queries.ts [--quick]
 *
 * Data: bench/lib/program-generator.ts, ten seasons of games and practices (full: about a million
 * grade rows; quick: about 110 000). The reports are asked for the current season.
 *
 *   api:      N sequential GETs over HTTP on 127.0.0.1 as a signed-in coach (session cookie), timed
 *             from request to the whole JSON body (fetch). Includes session, authorization, every
 *             query the route runs (server/development/*) and the statistics in TypeScript.
 *   hand SQL: the same aggregates written by hand (the season's final grades, by their stored
 *             flag, then counted), run by `psql -X -A -t -f -`; the baseline is the sum
 *             of psql's \timing figures for the statements (send → last row received, no process
 *             start or connect). The wall time of the whole psql process and of `SELECT 1` (the
 *             process start + connect overhead) are reported beside it.
 * API and psql runs alternate. The psql rows are checked against the API's numbers, so the baseline
 * does the same counting. When an endpoint misses a goal, its slowest query (found by running the
 * route's service with a logging Kysely) is EXPLAIN ANALYZEd into bench/results/.
 */
import { spawn } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { Kysely, PostgresDialect, type LogEvent } from 'kysely';
import type pg from 'pg';
import { createDatabase } from '../db/database';
import type { DB } from '../db/types';
import type { AppContext } from '../server/core/context';
import { comparePlayers } from '../server/development/comparison.service';
import { playerDevelopment } from '../server/development/development.service';
import { readinessMatrix } from '../server/development/readiness.service';
import { TEST_PASSWORD } from '../test/support/fixtures';
import { ApiSession } from './lib/api-session';
import { progress, REPO_ROOT, runCli } from './lib/bench-cli';
import { ratioOf, type BenchOptions, type BenchResult } from './lib/bench-result';
import { withBenchStack, type BenchStack } from './lib/bench-stack';
import { FULL_PROGRAM, generateProgram, QUICK_PROGRAM, type GeneratedProgram } from './lib/program-generator';
import { median, timed } from './lib/stats';

const API_GOAL_MS = 100;
const RATIO_GOAL = 1.5;

interface PsqlRun {
  wallMs: number;
  /** \timing of each statement, in order. */
  statementMs: number[];
  /** Result rows of each statement, split on `|`. */
  blocks: string[][][];
}

interface QueryCase {
  name: string;
  path: string;
  /** The hand-written statements, run in order in one psql process. */
  statements: string[];
  /** The route's service, called in-process to find its slowest query. */
  service: (app: AppContext) => Promise<unknown>;
  /** Throws when psql's numbers and the API's disagree. */
  check: (api: any, psql: PsqlRun) => void;
}

export async function run(options: BenchOptions): Promise<BenchResult[]> {
  const shape = options.quick ? QUICK_PROGRAM : FULL_PROGRAM;
  const samples = options.quick ? 5 : 30;
  return withBenchStack((stack) => measure(stack, options.quick, shape, samples));
}

async function measure(stack: BenchStack, quick: boolean, shape: typeof FULL_PROGRAM, samples: number): Promise<BenchResult[]> {
  const handle = createDatabase(stack.databaseUrl, { max: 4 });
  try {
    progress(`generating ${shape.seasons} seasons (${quick ? 'quick' : 'full'})`);
    const program = await generateProgram(handle, shape);
    const cases = await buildCases(handle.pool, program);
    const api = new ApiSession(stack.appUrl);
    await api.signIn(program.team.accounts.coach.email, TEST_PASSWORD);

    const spawnMs: number[] = [];
    for (let i = 0; i < samples; i += 1) spawnMs.push((await runPsql(stack.databaseUrl, ['SELECT 1'])).wallMs);
    const spawnP50 = median(spawnMs);
    progress(`psql start + connect + SELECT 1: p50 ${spawnP50.toFixed(1)} ms`);

    const results: BenchResult[] = [
      {
        name: `program generator: ${program.counts.grades} grade rows`,
        value: program.seconds,
        unit: 's',
        note: `${shape.seasons} seasons, ${program.counts.sessions} sessions, ${program.counts.snaps} snaps, ${program.counts.participants} participant rows; ${Math.round(program.counts.grades / program.seconds)} grades/s incl. fixture, VACUUM ANALYZE`,
      },
    ];
    const explains: string[] = [];
    const explainFile = join(REPO_ROOT, 'bench', 'results', `development-queries${quick ? '-quick' : ''}-explain-${new Date().toISOString().replace(/[:.]/g, '-')}.txt`);
    for (const c of cases) {
      // Warm-up: code paths, plans and caches on both sides.
      for (let i = 0; i < 2; i += 1) await api.json('GET', c.path);
      const first = await runPsql(stack.databaseUrl, c.statements);
      c.check(await api.json('GET', c.path), first);

      const apiMs: number[] = [];
      const psqlMs: number[] = [];
      const psqlWall: number[] = [];
      for (let i = 0; i < samples; i += 1) {
        const ways = i % 2 === 0 ? (['api', 'psql'] as const) : (['psql', 'api'] as const);
        for (const way of ways) {
          if (way === 'api') apiMs.push((await timed(() => api.json('GET', c.path))).ms);
          else {
            const r = await runPsql(stack.databaseUrl, c.statements);
            psqlMs.push(r.statementMs.reduce((a, b) => a + b, 0));
            psqlWall.push(r.wallMs);
          }
        }
      }
      const apiP50 = median(apiMs);
      const psqlP50 = median(psqlMs);
      const profile = await slowestQuery(handle.pool, c.service);
      progress(`${c.name}: api p50 ${apiP50.toFixed(1)} ms, psql p50 ${psqlP50.toFixed(1)} ms; slowest server query ${profile.ms.toFixed(1)} ms`);
      const ratio = ratioOf(apiP50, psqlP50);
      const missed = apiP50 >= API_GOAL_MS || (ratio ?? Infinity) > RATIO_GOAL;
      if (missed) explains.push(await explainBoth(handle.pool, c, profile));
      const plans = missed ? `; plans in ${explainFile.replace(`${REPO_ROOT}/`, '')}` : '';
      results.push(
        {
          name: `${c.name} API p50`,
          value: apiP50,
          unit: 'ms',
          goal: `< ${API_GOAL_MS}`,
          note: `p95 ${percentile(apiMs, 0.95).toFixed(1)} ms over ${samples} sequential GETs ${c.path.replace(/\d+/g, 'N')}; slowest of its ${profile.count} queries ${profile.ms.toFixed(1)} ms: ${profile.label}…${plans}`,
        },
        {
          name: `${c.name} API vs hand SQL (psql)`,
          value: apiP50,
          unit: 'ms',
          baseline: psqlP50,
          ratio,
          goal: `<= ${RATIO_GOAL}`,
          note: `baseline: psql \\timing sum of ${c.statements.length} statement(s), p50 (p95 ${percentile(psqlMs, 0.95).toFixed(1)} ms); whole psql process p50 ${median(psqlWall).toFixed(1)} ms`,
        },
      );
    }
    results.push({
      name: 'psql process start + connect (SELECT 1)',
      value: spawnP50,
      unit: 'ms',
      note: `p50 of ${samples} runs: what the whole-process psql wall times above include beyond the statements`,
    });
    if (explains.length) {
      mkdirSync(join(REPO_ROOT, 'bench', 'results'), { recursive: true });
      writeFileSync(explainFile, `${explains.join('\n\n')}\n`);
      progress(`EXPLAIN ANALYZE of the slow queries: ${explainFile}`);
    }
    return results;
  } finally {
    await handle.close();
  }
}

/** The three reports for the current season, with their hand-written SQL and the cross-checks. */
async function buildCases(pool: pg.Pool, program: GeneratedProgram): Promise<QueryCase[]> {
  const season = program.seasons.at(-1)!;
  const teamId = program.team.teamId;
  const starters = program.starters.get(season.id)!;
  const player = starters[0]!.playerId; // the left tackle: a senior, graded in four seasons
  const chart = await pool.query<{ player_id: string }>(`SELECT player_id FROM depth_chart_entries WHERE season_id = $1 AND position = 'LG' ORDER BY rank LIMIT 2`, [season.id]);
  const [a, b] = chart.rows.map((r) => Number(r.player_id)) as [number, number];

  const trendColumns = 'g.result, g.assignment, g.footwork, g.hands, g.pad_level, g.effort, g.position, s.session_id, s.concept_id, s.front_id, s.personnel, s.hash, s.quarter, s.down, s.distance, fs.kind, fs.date::text AS date, fs.title';
  const compareColumns = 'g.player_id, g.result, g.assignment, g.footwork, g.hands, g.pad_level, g.effort, g.position, s.session_id, fs.date::text AS date';
  const development: QueryCase = {
    name: 'player trend',
    path: `/api/players/${player}/development?seasonId=${season.id}`,
    statements: [
      `${finalGrades(teamId, season.id, [player], trendColumns)}
       SELECT session_id, date, kind, title, count(*) FILTER (WHERE result = 'plus') AS plus, count(*) FILTER (WHERE result = 'minus') AS minus
       FROM fg GROUP BY session_id, date, kind, title HAVING count(result) > 0 ORDER BY date, session_id`,
      `${finalGrades(teamId, season.id, [player], trendColumns)}
       SELECT count(*) FILTER (WHERE assignment = 'right'), count(*) FILTER (WHERE assignment = 'missed'),
              count(*) FILTER (WHERE footwork = 'plus'), count(*) FILTER (WHERE footwork = 'minus'),
              count(*) FILTER (WHERE hands = 'plus'), count(*) FILTER (WHERE hands = 'minus'),
              count(*) FILTER (WHERE pad_level = 'plus'), count(*) FILTER (WHERE pad_level = 'minus'),
              count(*) FILTER (WHERE effort = 'plus'), count(*) FILTER (WHERE effort IN ('minus', 'loaf'))
       FROM fg`,
      `${finalGrades(teamId, season.id, [player], trendColumns)}
       SELECT session_id, c.component, count(*) FILTER (WHERE c.mark IN ('plus', 'right')), count(*) FILTER (WHERE c.mark IN ('minus', 'missed', 'loaf'))
       FROM fg CROSS JOIN LATERAL (VALUES ('assignment', assignment), ('footwork', footwork), ('hands', hands), ('padLevel', pad_level), ('effort', effort)) AS c(component, mark)
       WHERE c.mark IS NOT NULL GROUP BY session_id, c.component`,
      `${finalGrades(teamId, season.id, [player], trendColumns)}
       , rows AS (
         SELECT fg.result, fg.position, fg.kind, fg.hash, fg.quarter::text AS quarter, fg.personnel, concept.name AS concept, front.name AS front,
                CASE WHEN fg.down IS NULL THEN NULL WHEN fg.down = 1 THEN '1st down' WHEN fg.down = 4 THEN '4th down'
                     WHEN fg.distance <= 3 THEN '2nd/3rd & short' WHEN fg.distance <= 6 THEN '2nd/3rd & medium' ELSE '2nd/3rd & long' END AS dd
         FROM fg LEFT JOIN tag_list_items concept ON concept.id = fg.concept_id LEFT JOIN tag_list_items front ON front.id = fg.front_id
         WHERE fg.result IS NOT NULL)
       SELECT GROUPING(concept, front, personnel, dd, hash, quarter, kind, position), coalesce(concept, front, personnel, dd, hash, quarter, kind, position),
              count(*) FILTER (WHERE result = 'plus'), count(*) FILTER (WHERE result = 'minus')
       FROM rows GROUP BY GROUPING SETS ((concept), (front), (personnel), (dd), (hash), (quarter), (kind), (position))`,
    ],
    service: (app) => playerDevelopment(app, player, season.id),
    check: (api: { overall: { plus: number; snaps: number }; sessions: unknown[] }, psql) => {
      const rows = psql.blocks[0]!;
      const plus = sum(rows.map((r) => Number(r[4])));
      const snaps = plus + sum(rows.map((r) => Number(r[5])));
      expectSame('player trend', { plus: api.overall.plus, snaps: api.overall.snaps, sessions: api.sessions.length }, { plus, snaps, sessions: rows.length });
    },
  };

  const comparison: QueryCase = {
    name: 'comparison',
    path: `/api/comparisons?players=${a},${b}&seasonId=${season.id}`,
    statements: [
      `${finalGrades(teamId, season.id, [a, b], compareColumns)}
       SELECT player_id, count(*) FILTER (WHERE result = 'plus'), count(*) FILTER (WHERE result = 'minus') FROM fg GROUP BY player_id ORDER BY player_id`,
      `${finalGrades(teamId, season.id, [a, b], compareColumns)}
       SELECT player_id, c.component, count(*) FILTER (WHERE c.mark IN ('plus', 'right')), count(*) FILTER (WHERE c.mark IN ('minus', 'missed', 'loaf'))
       FROM fg CROSS JOIN LATERAL (VALUES ('assignment', assignment), ('footwork', footwork), ('hands', hands), ('padLevel', pad_level), ('effort', effort)) AS c(component, mark)
       WHERE c.mark IS NOT NULL GROUP BY player_id, c.component`,
      `${finalGrades(teamId, season.id, [a, b], compareColumns)}
       SELECT player_id, coalesce(position, '?'), count(*) FROM fg WHERE result IS NOT NULL GROUP BY player_id, position`,
      `${finalGrades(teamId, season.id, [a, b], compareColumns)}
       SELECT player_id, session_id, date, count(*) FILTER (WHERE result = 'plus'), count(*) FILTER (WHERE result = 'minus')
       FROM fg GROUP BY player_id, session_id, date ORDER BY date`,
    ],
    service: (app) => comparePlayers(app, teamId, [a, b], season.id),
    check: (api: { players: { playerId: number; plus: number; snaps: number }[] }, psql) => {
      const rows = psql.blocks[0]!;
      for (const p of api.players) {
        const row = rows.find((r) => Number(r[0]) === p.playerId);
        const plus = Number(row?.[1] ?? 0);
        expectSame(`comparison player ${p.playerId}`, { plus: p.plus, snaps: p.snaps }, { plus, snaps: plus + Number(row?.[2] ?? 0) });
      }
    },
  };

  const readiness: QueryCase = {
    name: 'readiness matrix',
    path: `/api/teams/${teamId}/readiness?seasonId=${season.id}`,
    statements: [
      `${finalGrades(teamId, season.id, undefined, 'g.result, s.concept_id, s.front_id, fs.kind')}
       SELECT concept_id, front_id, kind, count(*) FILTER (WHERE result = 'plus'), count(*) FILTER (WHERE result = 'minus')
       FROM fg WHERE concept_id IS NOT NULL AND front_id IS NOT NULL AND result IS NOT NULL
       GROUP BY GROUPING SETS ((concept_id, front_id), (concept_id, front_id, kind))`,
    ],
    service: (app) => readinessMatrix(app, teamId, season.id),
    check: (api: { cells: { reps: number; plus: number; gameReps: number }[] }, psql) => {
      const totals = psql.blocks[0]!.filter((r) => r[2] === '');
      const games = psql.blocks[0]!.filter((r) => r[2] === 'game');
      expectSame(
        'readiness matrix',
        { reps: sum(api.cells.map((c) => c.reps)), plus: sum(api.cells.map((c) => c.plus)), gameReps: sum(api.cells.map((c) => c.gameReps)) },
        { reps: sum(totals.map((r) => Number(r[3]) + Number(r[4]))), plus: sum(totals.map((r) => Number(r[3]))), gameReps: sum(games.map((r) => Number(r[3]) + Number(r[4]))) },
      );
    },
  };
  return [development, comparison, readiness];
}

/**
 * The final grade of each snap and player inside the season (and for the players asked), read by
 * hand from the stored flag that triggers keep current (db/migrations/…_final_grade_flag.ts):
 * what a DBA would write against this schema.
 */
function finalGrades(teamId: number, seasonId: number, players: number[] | undefined, columns: string): string {
  const ints = (ids: number[]) => ids.map((id) => String(Math.trunc(id))).join(',');
  return `WITH fg AS (
    SELECT ${columns}
    FROM film_sessions fs
    JOIN snaps s ON s.session_id = fs.id
    JOIN grades g ON g.snap_id = s.id AND g.is_final
    WHERE fs.team_id = ${Math.trunc(teamId)} AND fs.season_id = ${Math.trunc(seasonId)}${players ? ` AND g.player_id IN (${ints(players)})` : ''})`;
}

/** One psql process running the statements with \timing; markers separate their rows. */
function runPsql(databaseUrl: string, statements: string[]): Promise<PsqlRun> {
  const script = ['\\timing on', ...statements.flatMap((s, i) => [`\\echo ==${i}`, `${s.trim()};`])].join('\n');
  return new Promise((resolve, reject) => {
    const started = process.hrtime.bigint();
    const child = spawn('psql', ['-X', '-A', '-t', '-q', '-v', 'ON_ERROR_STOP=1', '-d', databaseUrl, '-f', '-'], { stdio: ['pipe', 'pipe', 'pipe'] });
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    child.stdout.on('data', (d: Buffer) => out.push(d));
    child.stderr.on('data', (d: Buffer) => err.push(d));
    child.on('error', reject);
    child.on('close', (code) => {
      const wallMs = Number(process.hrtime.bigint() - started) / 1e6;
      if (code !== 0) return reject(new Error(`psql exited ${code}: ${Buffer.concat(err).toString().slice(0, 2000)}`));
      const statementMs: number[] = [];
      const blocks: string[][][] = [];
      for (const line of Buffer.concat(out).toString('utf8').split('\n')) {
        const time = /^Time: ([\d.]+) ms/.exec(line);
        if (time) statementMs.push(Number(time[1]));
        else if (/^==\d+$/.test(line)) blocks.push([]);
        else if (line !== '' && line !== 'Timing is on.' && blocks.length) blocks.at(-1)!.push(line.split('|'));
      }
      if (statementMs.length !== statements.length) return reject(new Error(`psql printed ${statementMs.length} timings for ${statements.length} statements`));
      resolve({ wallMs, statementMs, blocks });
    });
    child.stdin.end(script);
  });
}

interface QueryProfile {
  ms: number;
  label: string;
  sql: string;
  parameters: readonly unknown[];
  count: number;
}

/** Runs a route's service in-process with a logging Kysely (twice; the second run counts) and answers its slowest query. */
async function slowestQuery(pool: pg.Pool, service: (app: AppContext) => Promise<unknown>): Promise<QueryProfile> {
  let events: LogEvent[] = [];
  const db = new Kysely<DB>({ dialect: new PostgresDialect({ pool }), log: (event) => void events.push(event) });
  const app = { db, now: () => new Date() } as unknown as AppContext;
  await service(app);
  events = [];
  await service(app);
  const slowest = events.reduce((a, b) => (b.queryDurationMillis > a.queryDurationMillis ? b : a));
  const sql = slowest.query.sql;
  const label = sql.replace(/\s+/g, ' ').trim().slice(0, 70);
  return { ms: slowest.queryDurationMillis, label, sql, parameters: slowest.query.parameters, count: events.length };
}

/** EXPLAIN (ANALYZE, BUFFERS) of the route's slowest query and of the hand-written statements, as text. */
async function explainBoth(pool: pg.Pool, c: QueryCase, profile: QueryProfile): Promise<string> {
  const plan = async (sql: string, params: readonly unknown[] = []) =>
    (await pool.query<{ 'QUERY PLAN': string }>(`EXPLAIN (ANALYZE, BUFFERS) ${sql}`, params as unknown[])).rows.map((r) => r['QUERY PLAN']).join('\n');
  const parts = [
    `=== ${c.name}: slowest query the API runs (${profile.ms.toFixed(1)} ms in-process), parameters ${JSON.stringify(profile.parameters)}`,
    profile.sql.trim(),
    '--- plan',
    await plan(profile.sql, profile.parameters),
  ];
  for (const [i, s] of c.statements.entries()) parts.push(`=== ${c.name}: hand-written statement ${i + 1}`, s.trim(), '--- plan', await plan(s));
  return parts.join('\n');
}

function expectSame(what: string, api: Record<string, number>, psql: Record<string, number>): void {
  if (Object.keys(api).some((k) => api[k] !== psql[k])) throw new Error(`${what}: the API says ${JSON.stringify(api)}, the hand-written SQL ${JSON.stringify(psql)}`);
}

function sum(values: number[]): number {
  return values.reduce((a, b) => a + b, 0);
}

function percentile(values: readonly number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil(p * sorted.length) - 1)]!;
}

if (require.main === module) runCli('development-queries', run);
