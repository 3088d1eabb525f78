/**
 * Grade saves under load (issue 4): 50 concurrent clients saving grades through the real API, next
 * to a bare Express route doing one INSERT on the same database in the same run, with about a
 * million grade rows already stored (quick: about 110 000).
 *
 *   node --import tsx bench/grade-saves.ts [--quick]
 *
 * Data: bench/lib/program-generator.ts (ten seasons), then 50 coach accounts, each grading its own
 * game of the current season (80 snaps × the five starters: 400 cells of its own, so saves never
 * race each other for a cell).
 *   api:  PUT /api/snaps/{snapId}/grades/{playerId} over HTTP on 127.0.0.1, each connection signed
 *         in as its own coach (session cookie + X-XSRF-TOKEN). A connection alternates a new grade
 *         (version 0) with an edit of the grade it just saved, sending the version the last answer
 *         gave (a coach correcting a mark); 409s are counted.
 *   bare: PUT /bare/grades/{key} to bench/lib/bare-insert-server.ts (its own process, one pg Pool of
 *         the API's size): the same body, one INSERT into bench_bare, a copy of the grades table
 *         with its indexes and rows.
 * Load: autocannon, 50 connections, no pipelining (closed loop: a connection sends its next save
 * when the last is answered), warm-up first, then the API and the bare route for the same duration
 * (full 15 s, quick 3 s). Full runs add a paced run of each (every client one save a second, starts
 * spread over the first second), for latency below saturation. Afterwards the stored grades are
 * checked against what the clients were told, so fast failures cannot pass for saves.
 */
import { Agent, request } from 'node:http';
import { join } from 'node:path';
import { createDatabase, type DatabaseHandle } from '../db/database';
import { hashPassword } from '../server/core/password-hashing';
import { tsxChild } from '../scripts/stack/entries';
import { ManagedChild } from '../scripts/stack/managed-child';
import { TEST_PASSWORD } from '../test/support/fixtures';
import { ApiSession } from './lib/api-session';
import { progress, REPO_ROOT, runCli } from './lib/bench-cli';
import { ratioOf, type BenchOptions, type BenchResult } from './lib/bench-result';
import { withBenchStack, type BenchStack } from './lib/bench-stack';
import { FULL_PROGRAM, generateProgram, QUICK_PROGRAM, type GeneratedProgram } from './lib/program-generator';

const CONNECTIONS = 50;
const SNAPS_PER_CLIENT = 80;
const P99_GOAL_MS = 50;
const THROUGHPUT_RATIO_GOAL = 0.5;
/** Saves per second per connection in the paced runs: a coach saving once a second, well below saturation. */
const PACED_RATE = 1;

/** The part of autocannon 8's API used here (it ships no types). */
interface AutocannonRequest {
  method?: string;
  path?: string;
  headers?: Record<string, string>;
  body?: string;
  setupRequest?: (request: AutocannonRequest, context: object) => AutocannonRequest;
  onResponse?: (status: number, body: string, context: object) => void;
}
interface AutocannonClient {
  setRequests(requests: AutocannonRequest[]): void;
}
interface AutocannonResult {
  duration: number;
  latency: { p50: number; p99: number; p97_5: number; average: number; max: number };
  requests: { average: number; total: number };
  '2xx': number;
  non2xx: number;
  errors: number;
  timeouts: number;
  statusCodeStats: Record<string, { count: number }>;
}
type Autocannon = (options: Record<string, unknown>, done: (error: Error | null, result: AutocannonResult) => void) => unknown;
// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require('autocannon') as Autocannon;

interface Cell {
  snapId: number;
  playerId: number;
}

/** What a request is for, and the answer's effect on the client's knowledge of its grades. */
interface LoadClient {
  next(): { path: string; body: string };
  answered(status: number, body: string): void;
  /** A new run starts: a request left unanswered by the last one may or may not have been applied. */
  restart(): void;
}

/**
 * One coach's connection: new grade, then an edit of it with the version the save answered, and
 * so on; once its own cells are used up, edits of its grades in turn.
 */
class GradingClient implements LoadClient {
  readonly versions = new Map<string, number>();
  private readonly uncertain = new Set<string>();
  private nextNew = 0;
  private step = 0;
  private lastSaved: Cell | undefined;
  private pending: { cell: Cell; edit: boolean } | undefined;
  private editTurn = 0;
  conflicts = 0;

  constructor(private readonly cells: Cell[]) {}

  next(): { path: string; body: string } {
    this.step += 1;
    const key = (c: Cell) => `${c.snapId}:${c.playerId}`;
    let cell: Cell;
    let edit: boolean;
    if (this.step % 2 === 0 && this.lastSaved) {
      cell = this.lastSaved;
      edit = true;
    } else if (this.nextNew < this.cells.length) {
      cell = this.cells[this.nextNew++]!;
      edit = false;
    } else {
      const known = this.cells.filter((c) => this.versions.has(key(c)) && !this.uncertain.has(key(c)));
      cell = known[this.editTurn++ % known.length]!;
      edit = true;
    }
    this.pending = { cell, edit };
    const version = edit ? this.versions.get(key(cell))! : 0;
    // An edit flips footwork, so every save changes the grade.
    const footwork = edit && version % 2 === 1 ? 'minus' : 'plus';
    return {
      path: `/api/snaps/${cell.snapId}/grades/${cell.playerId}`,
      body: JSON.stringify({ assignment: 'right', footwork, hands: 'plus', padLevel: 'plus', effort: 'plus', version }),
    };
  }

  answered(status: number, body: string): void {
    const sent = this.pending;
    this.pending = undefined;
    if (!sent) return;
    const key = `${sent.cell.snapId}:${sent.cell.playerId}`;
    if (status === 200) {
      this.versions.set(key, (JSON.parse(body) as { version: number }).version);
      this.lastSaved = sent.cell;
    } else if (status === 409) {
      this.conflicts += 1;
      const current = (JSON.parse(body) as { error?: { current?: { version: number } | null } }).error?.current;
      if (current) this.versions.set(key, current.version);
      this.lastSaved = undefined;
    }
  }

  restart(): void {
    if (this.pending) this.uncertain.add(`${this.pending.cell.snapId}:${this.pending.cell.playerId}`);
    this.pending = undefined;
    this.lastSaved = undefined;
  }
}

/** The bare route's client: every request a new row. */
class BareClient implements LoadClient {
  private n = 0;
  constructor(private readonly base: number) {}
  next(): { path: string; body: string } {
    this.n += 1;
    return { path: `/bare/grades/${this.base + this.n}`, body: JSON.stringify({ assignment: 'right', footwork: 'plus', hands: 'plus', padLevel: 'plus', effort: 'plus', version: 0 }) };
  }
  answered(): void {}
  restart(): void {}
}

export async function run(options: BenchOptions): Promise<BenchResult[]> {
  const shape = options.quick ? QUICK_PROGRAM : FULL_PROGRAM;
  const seconds = options.quick ? 3 : 15;
  const warmUp = options.quick ? 1 : 3;
  // Paced runs only in the full benchmark: --quick must keep every benchmark under two minutes.
  const pacedSeconds = options.quick ? 0 : 10;
  return withBenchStack((stack) => measure(stack, shape, seconds, warmUp, pacedSeconds));
}

async function measure(stack: BenchStack, shape: typeof FULL_PROGRAM, seconds: number, warmUp: number, pacedSeconds: number): Promise<BenchResult[]> {
  const handle = createDatabase(stack.databaseUrl, { max: 4 });
  let bare: ManagedChild | undefined;
  try {
    const program = await generateProgram(handle, shape);
    const cellsOf = await createGradingGames(handle, program);
    const storedRows = Number((await handle.pool.query<{ n: string }>(`SELECT count(*) AS n FROM grades`)).rows[0]!.n);
    bare = new ManagedChild({
      ...tsxChild('bare', 'bench/lib/bare-insert-server.ts', REPO_ROOT, { ...process.env, DATABASE_URL: stack.databaseUrl, POOL_MAX: stack.env.DATABASE_POOL_MAX || '10' }, { file: join(stack.runDir, 'bare.log') }),
      ipc: true,
    });
    const bareChild = bare;
    // Side by side, as they do not touch each other: the bare table's copy, the bare server's start, the sign-ins.
    progress(`copying the grades into bench_bare for the bare route; signing in ${CONNECTIONS} coaches`);
    const [, { port }, sessions] = await Promise.all([
      (async () => {
        await handle.pool.query(`CREATE TABLE bench_bare (LIKE grades INCLUDING ALL)`);
        await handle.pool.query(`CREATE SEQUENCE bench_bare_id_seq OWNED BY bench_bare.id`);
        await handle.pool.query(`ALTER TABLE bench_bare ALTER COLUMN id SET DEFAULT nextval('bench_bare_id_seq')`);
        await handle.pool.query(`INSERT INTO bench_bare SELECT * FROM grades`);
        await handle.pool.query(`SELECT setval('bench_bare_id_seq', (SELECT max(id) FROM bench_bare))`);
        await handle.pool.query(`VACUUM (ANALYZE) bench_bare`);
      })(),
      bareChild.waitForReady<{ port: number }>(30_000),
      Promise.all(
        cellsOf.map(async ({ email }) => {
          const api = new ApiSession(stack.appUrl);
          await api.signIn(email, TEST_PASSWORD);
          return { ...api.headersFor('PUT'), 'content-type': 'application/json' };
        }),
      ),
    ]);
    const bareUrl = `http://127.0.0.1:${port}`;
    const graders = cellsOf.map(({ cells }) => new GradingClient(cells));
    const bareClients = cellsOf.map((_, i) => new BareClient(100_000_000 + i * 1_000_000));

    progress(`warm-up: ${warmUp} s each`);
    await load(stack.appUrl, graders, sessions, warmUp);
    await load(bareUrl, bareClients, sessions, warmUp);
    progress(`api: ${CONNECTIONS} connections for ${seconds} s`);
    const api = await load(stack.appUrl, graders, sessions, seconds);
    progress(`bare: ${CONNECTIONS} connections for ${seconds} s`);
    const base = await load(bareUrl, bareClients, sessions, seconds);
    let pacedRuns: { api: AutocannonResult; bare: AutocannonResult } | undefined;
    if (pacedSeconds > 0) {
      progress(`paced: ${CONNECTIONS} clients × ${PACED_RATE} save/s for ${pacedSeconds} s each`);
      pacedRuns = { api: await paced(stack.appUrl, graders, sessions, pacedSeconds), bare: await paced(bareUrl, bareClients, sessions, pacedSeconds) };
    }
    const runs: [string, AutocannonResult][] = [['api', api], ['bare', base], ...(pacedRuns ? ([['api paced', pacedRuns.api], ['bare paced', pacedRuns.bare]] as [string, AutocannonResult][]) : [])];
    for (const [name, r] of runs) {
      progress(`${name}: p50 ${r.latency.p50} ms, p99 ${r.latency.p99} ms, ${r['2xx']} saves in ${r.duration.toFixed(1)} s, statuses ${JSON.stringify(r.statusCodeStats)}`);
      const unexpected = Object.keys(r.statusCodeStats).filter((s) => s !== '200' && s !== '409');
      if (unexpected.length || r.errors || r.timeouts) {
        throw new Error(`${name}: unexpected answers ${JSON.stringify(r.statusCodeStats)}, ${r.errors} errors, ${r.timeouts} timeouts (see ${stack.serverLog})`);
      }
    }
    await checkStored(handle, cellsOf, graders);

    const conflicts = graders.reduce((n, g) => n + g.conflicts, 0);
    const apiRate = api['2xx'] / api.duration;
    const bareRate = base['2xx'] / base.duration;
    const size = `${Math.round(storedRows / 1000)}k grade rows stored`;
    return [
      {
        name: `grade save throughput, ${CONNECTIONS} clients`,
        value: apiRate,
        unit: 'saves/s',
        baseline: bareRate,
        ratio: ratioOf(apiRate, bareRate),
        goal: `>= ${THROUGHPUT_RATIO_GOAL}`,
        note: `ratio = api/bare, 2xx answers per second over ${seconds} s; half new grades (version 0), half edits with the version last answered; ${size}`,
      },
      {
        name: `grade save p99 latency, ${CONNECTIONS} clients`,
        value: api.latency.p99,
        unit: 'ms',
        baseline: base.latency.p99,
        goal: `< ${P99_GOAL_MS}`,
        note: `goal on the API figure, baseline = bare route; closed loop (each connection sends its next save when answered), so latency ≈ ${CONNECTIONS} ÷ throughput`,
      },
      {
        name: `grade save p50 latency, ${CONNECTIONS} clients`,
        value: api.latency.p50,
        unit: 'ms',
        baseline: base.latency.p50,
        ratio: ratioOf(api.latency.p50, base.latency.p50),
        note: `ratio = api/bare; p97.5 ${api.latency.p97_5} ms, max ${api.latency.max} ms (bare max ${base.latency.max} ms)`,
      },
      ...(pacedRuns
        ? [
            {
              name: `grade save p99, ${CONNECTIONS} clients × ${PACED_RATE}/s (paced)`,
              value: pacedRuns.api.latency.p99,
              unit: 'ms',
              baseline: pacedRuns.bare.latency.p99,
              note: `informative, no goal: ${CONNECTIONS * PACED_RATE} saves/s offered for ${pacedSeconds} s (starts spread over a second), below saturation; p50 ${pacedRuns.api.latency.p50} ms (bare ${pacedRuns.bare.latency.p50} ms); ${pacedRuns.api['2xx']} saves`,
            },
          ]
        : []),
      {
        name: 'grade save conflicts (409)',
        value: conflicts,
        unit: '',
        note: `over all runs (${graders.reduce((n, g) => n + g.versions.size, 0)} cells graded); each client owns its cells and sends the version last answered, so 0 is expected`,
      },
    ];
  } finally {
    await bare?.stop(5_000);
    await handle.close();
  }
}

/** One coach account per connection, each with a game of its own in the current season (snaps, no grades yet). */
async function createGradingGames(handle: DatabaseHandle, program: GeneratedProgram): Promise<{ email: string; cells: Cell[] }[]> {
  const season = program.seasons.at(-1)!;
  const starters = program.starters.get(season.id)!;
  const passwordHash = await hashPassword(TEST_PASSWORD);
  const out: { email: string; cells: Cell[] }[] = [];
  const { rows: users } = await handle.pool.query<{ id: string; email: string }>(
    `INSERT INTO users (email, name, password_hash)
     SELECT 'grader' || i || '.' || $1 || '@bench.test', 'Bench grader ' || i, $2 FROM generate_series(1, $3::int) AS i
     RETURNING id, email`,
    [program.team.teamId, passwordHash, CONNECTIONS],
  );
  await handle.pool.query(`INSERT INTO memberships (user_id, team_id, role) SELECT unnest($1::bigint[]), $2::bigint, 'coach'`, [users.map((u) => u.id), program.team.teamId]);
  const { rows: sessions } = await handle.pool.query<{ id: string }>(
    `INSERT INTO film_sessions (team_id, season_id, kind, title, date, opponent, week, created_by)
     SELECT $1::bigint, $2::bigint, 'game', 'Bench grading game ' || i, DATE '2026-11-20', 'Bench opponent', 12, $3::bigint FROM generate_series(1, $4::int) AS i
     RETURNING id`,
    [program.team.teamId, season.id, program.team.accounts.coach.userId, CONNECTIONS],
  );
  const { rows: snaps } = await handle.pool.query<{ id: string; session_id: string }>(
    `INSERT INTO snaps (session_id, "order", quarter, down, distance)
     SELECT s, n, 1 + (n - 1) * 4 / $2::int, 1, 10 FROM unnest($1::bigint[]) AS s, generate_series(1, $2::int) AS n
     RETURNING id, session_id`,
    [sessions.map((s) => s.id), SNAPS_PER_CLIENT],
  );
  for (const [i, user] of users.entries()) {
    const own = snaps.filter((s) => s.session_id === sessions[i]!.id).map((s) => Number(s.id));
    out.push({ email: user.email, cells: own.flatMap((snapId) => starters.map((p) => ({ snapId, playerId: p.playerId }))) });
  }
  await handle.pool.query(`ANALYZE snaps; ANALYZE film_sessions; ANALYZE users; ANALYZE memberships`);
  return out;
}

/** autocannon with one LoadClient per connection (setupClient gives each connection its own requests). */
function load(url: string, clients: LoadClient[], headers: Record<string, string>[], seconds: number): Promise<AutocannonResult> {
  let connection = 0;
  for (const c of clients) c.restart();
  return new Promise((resolve, reject) => {
    autocannon(
      {
        url,
        connections: clients.length,
        pipelining: 1,
        duration: seconds,
        timeout: 30,
        setupClient: (client: AutocannonClient) => {
          const i = connection++ % clients.length;
          const state = clients[i]!;
          client.setRequests([
            {
              method: 'PUT',
              setupRequest: (request) => ({ ...request, method: 'PUT', headers: headers[i]!, ...state.next() }),
              onResponse: (status, body) => state.answered(status, body),
            },
          ]);
        },
      },
      (error, result) => (error ? reject(error) : resolve(result)),
    );
  });
}

/**
 * Below saturation: each client saves PACED_RATE times a second, the clients' starts spread over
 * the first second (autocannon's rate limit fires every connection on the same tick, which
 * measures bursts). fetch with keep-alive; answers must be 200 or 409 as in the load runs.
 */
async function paced(url: string, clients: LoadClient[], headers: Record<string, string>[], seconds: number): Promise<AutocannonResult> {
  const interval = 1000 / PACED_RATE;
  const latencies: number[] = [];
  const statusCodeStats: Record<string, { count: number }> = {};
  let errors = 0;
  for (const c of clients) c.restart();
  // Connections of its own: idle ones in a shared pool may have been closed by the server meanwhile.
  const agent = new Agent({ keepAlive: true, maxSockets: clients.length });
  const started = Date.now();
  const stopAt = started + seconds * 1000;
  await Promise.all(
    clients.map(async (client, i) => {
      await sleep((i * interval) / clients.length);
      while (Date.now() < stopAt) {
        const due = Date.now() + interval;
        const { path, body } = client.next();
        const t0 = process.hrtime.bigint();
        try {
          const response = await put(agent, new URL(path, url), headers[i]!, body);
          latencies.push(Number(process.hrtime.bigint() - t0) / 1e6);
          (statusCodeStats[response.status] ??= { count: 0 }).count += 1;
          client.answered(response.status, response.text);
        } catch (error) {
          errors += 1;
          if (errors <= 3) progress(`paced save failed: ${(error as Error).message} ${String((error as { cause?: unknown }).cause ?? '')}`);
        }
        await sleep(due - Date.now());
      }
    }),
  );
  agent.destroy();
  const sorted = latencies.sort((a, b) => a - b);
  const at = (p: number) => Math.round(sorted[Math.min(sorted.length - 1, Math.ceil(p * sorted.length) - 1)] ?? NaN);
  const ok = statusCodeStats['200']?.count ?? 0;
  return {
    duration: (Date.now() - started) / 1000,
    latency: { p50: at(0.5), p99: at(0.99), p97_5: at(0.975), average: sorted.reduce((a, b) => a + b, 0) / sorted.length, max: Math.round(sorted.at(-1) ?? NaN) },
    requests: { average: latencies.length / seconds, total: latencies.length },
    '2xx': ok,
    non2xx: latencies.length - ok,
    errors,
    timeouts: 0,
    statusCodeStats,
  };
}

function put(agent: Agent, url: URL, headers: Record<string, string>, body: string): Promise<{ status: number; text: string }> {
  return new Promise((resolve, reject) => {
    const req = request(url, { method: 'PUT', agent, headers: { ...headers, 'content-length': String(Buffer.byteLength(body)) } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, text: Buffer.concat(chunks).toString('utf8') }));
      res.on('error', reject);
    });
    req.on('error', reject);
    req.end(body);
  });
}

function sleep(ms: number): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, Math.max(0, ms)));
}

/** The stored grades are what the clients were told: a new grade per 200 answer, versions as answered. */
async function checkStored(handle: DatabaseHandle, cellsOf: { cells: Cell[] }[], graders: GradingClient[]): Promise<void> {
  const snapIds = cellsOf.flatMap(({ cells }) => cells.map((c) => c.snapId));
  const { rows } = await handle.pool.query<{ snap_id: string; player_id: string; version: number }>(
    `SELECT snap_id, player_id, version FROM grades WHERE snap_id = ANY($1::bigint[])`,
    [[...new Set(snapIds)]],
  );
  const stored = new Map(rows.map((r) => [`${r.snap_id}:${r.player_id}`, r.version]));
  let known = 0;
  let ahead = 0;
  for (const g of graders) {
    for (const [key, version] of g.versions) {
      known += 1;
      const actual = stored.get(key);
      if (actual === undefined) throw new Error(`grade ${key}: answered version ${version}, but nothing is stored`);
      if (actual === version + 1) ahead += 1; // an edit the run ended before its answer arrived
      else if (actual !== version) throw new Error(`grade ${key}: answered version ${version}, stored ${actual}`);
    }
  }
  // Requests cut off at the end of a run (at most one per connection and run) may have been applied unanswered.
  const unanswered = rows.length - known + ahead;
  if (unanswered > graders.length * 4) throw new Error(`${unanswered} stored grades or versions the clients were never told about`);
  progress(`stored grades checked: ${rows.length} in the bench games, ${known} as answered, ${unanswered} applied after their run ended`);
}

if (require.main === module) runCli('grade-saves', run);
