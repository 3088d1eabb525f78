/**
 * The mixed load of issue 7's load drill, shared by test/integration/load-drill.test.ts (bounded,
 * in-process server) and bench/drills/load.ts (longer, the server as its own process):
 *
 *   grade saves    PUT /api/snaps/{snapId}/grades/{playerId}  (a new grade, then edits of it with
 *                  the version the last answer gave, as the grading desk sends them)
 *   development    GET /api/players/{id}/development
 *   clip listing   GET /api/film-sessions/{id}/clips
 *
 * from N clients at once, each signed in as its own coach (session cookie + X-XSRF-TOKEN), plain
 * fetch loops on keep-alive connections, for a fixed time. Every cell (snap × player) belongs to one
 * client, so no save races another: any 409 is a failure here, as is any 5xx, any other unexpected
 * status, a timeout or a connection error. Afterwards the stored grades are compared with what the
 * clients were told, so fast failures cannot pass for saves.
 */
import { hashPassword } from '../../../server/core/password-hashing';
import type { Database } from '../../../db/database';
import { createTeamFixture, TEST_PASSWORD, type TeamFixture } from '../../../test/support/fixtures';

export type LoadKind = 'gradeSave' | 'development' | 'clipList';
export const LOAD_KINDS: readonly LoadKind[] = ['gradeSave', 'development', 'clipList'];

export interface LoadTarget {
  team: TeamFixture;
  sessionId: number;
  snapIds: number[];
  /** One coach account per client. */
  coaches: { userId: number; email: string }[];
  /** The version each client was last told for each of its cells ("snapId:playerId:graderId"), across runs. */
  versions: Map<string, number>;
}

export interface KindFigures {
  count: number;
  failures: number;
  p50Ms: number;
  p99Ms: number;
  maxMs: number;
}

export interface LoadReport {
  clients: number;
  durationMs: number;
  requests: number;
  requestsPerSecond: number;
  byKind: Record<LoadKind, KindFigures>;
  statuses: Record<string, number>;
  /** Unexpected statuses, timeouts and connection errors, first 20 described. */
  failures: number;
  failureSamples: string[];
  connectionErrors: number;
  gradesSaved: number;
  /** Cells whose stored version differs from the one the client was last told (0 when all is well). */
  gradeMismatches: number;
}

/**
 * A team for the drill: the usual fixture (three linemen), `extraPlayers` more on the roster, one
 * coach account per client, a game with `snaps` snaps and `clips` clip rows (listing reads rows only).
 */
export async function prepareLoadTarget(db: Database, options: { clients: number; snaps: number; clips: number; extraPlayers?: number }): Promise<LoadTarget> {
  const team = await createTeamFixture(db, 'Load');
  for (let i = 0; i < (options.extraPlayers ?? 2); i += 1) {
    const player = await db.insertInto('players').values({ team_id: team.teamId, name: `Lineman ${i + 4}` }).returning('id').executeTakeFirstOrThrow();
    await db
      .insertInto('roster_entries')
      .values({ season_id: team.seasonId, player_id: player.id, jersey: 60 + i, positions: ['RG'], class_year: 'So', height_in: 76, weight_lb: 290 })
      .execute();
    team.playerIds.push(player.id);
  }
  const passwordHash = await hashPassword(TEST_PASSWORD);
  const coaches: LoadTarget['coaches'] = [];
  for (let i = 0; i < options.clients; i += 1) {
    const email = `coach${i}.${team.teamId}@load.test`;
    const user = await db.insertInto('users').values({ email, name: `Load coach ${i}`, password_hash: passwordHash }).returning('id').executeTakeFirstOrThrow();
    await db.insertInto('memberships').values({ user_id: user.id, team_id: team.teamId, role: 'coach', player_id: null }).execute();
    coaches.push({ userId: user.id, email });
  }
  const session = await db
    .insertInto('film_sessions')
    .values({ team_id: team.teamId, season_id: team.seasonId, kind: 'game', title: 'Week 5 vs Granite Falls', date: '2026-10-02', opponent: 'Granite Falls' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const snapIds: number[] = [];
  for (let order = 1; order <= options.snaps; order += 1) {
    snapIds.push((await db.insertInto('snaps').values({ session_id: session.id, order }).returning('id').executeTakeFirstOrThrow()).id);
  }
  for (let i = 0; i < options.clips; i += 1) {
    await db
      .insertInto('clips')
      .values({
        team_id: team.teamId,
        session_id: session.id,
        snap_id: snapIds[i % snapIds.length]!,
        upload_order: i + 1,
        original_name: `play-${i + 1}.mp4`,
        status: 'ready',
        size_bytes: 1_000_000 + i,
        duration_ms: 6000,
        width: 1280,
        height: 720,
      })
      .execute();
  }
  return { team, sessionId: session.id, snapIds, coaches, versions: new Map() };
}

/** Cookies and the CSRF echo of one signed-in browser, over fetch. */
export class Browser {
  private readonly cookies = new Map<string, string>();

  constructor(private readonly baseUrl: string) {}

  async signIn(email: string): Promise<void> {
    await this.send('GET', '/api/health');
    const res = await this.send('POST', '/api/auth/login', { email, password: TEST_PASSWORD });
    if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${await res.text()}`);
    await res.arrayBuffer();
  }

  async send(method: string, path: string, body?: unknown, timeoutMs = 10_000): Promise<Response> {
    const headers: Record<string, string> = {};
    if (this.cookies.size) headers.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    const xsrf = this.cookies.get('XSRF-TOKEN');
    if (method !== 'GET' && xsrf) headers['x-xsrf-token'] = decodeURIComponent(xsrf);
    if (body !== undefined) headers['content-type'] = 'application/json';
    const res = await fetch(new URL(path, this.baseUrl), { method, headers, body: body === undefined ? undefined : JSON.stringify(body), signal: AbortSignal.timeout(timeoutMs) });
    for (const line of res.headers.getSetCookie()) {
      const match = /^([^=;\s]+)=([^;]*)/.exec(line);
      if (!match) continue;
      if (match[2] === '' || /;\s*expires=Thu, 01 Jan 1970/i.test(line)) this.cookies.delete(match[1]!);
      else this.cookies.set(match[1]!, match[2]!);
    }
    return res;
  }
}

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))]!;
}

/** A small deterministic PRNG (xorshift32), so a run's mix can be repeated. */
function prng(seed: number): () => number {
  let x = seed >>> 0 || 1;
  return () => {
    x ^= x << 13;
    x >>>= 0;
    x ^= x >>> 17;
    x ^= x << 5;
    x >>>= 0;
    return x / 0x100000000;
  };
}

const GRADE_BODIES = [
  { assignment: 'right', footwork: 'plus', hands: 'plus', padLevel: 'plus', effort: 'plus', knockdowns: 1 },
  { assignment: 'right', footwork: 'minus', hands: 'plus', padLevel: 'plus', effort: 'plus' },
  { assignment: 'missed', footwork: 'plus', hands: 'minus', padLevel: 'minus', effort: 'loaf', note: 'Late off the ball.' },
  { assignment: 'right', footwork: 'plus', hands: 'plus', padLevel: 'minus', effort: 'plus', pressuresAllowed: 1 },
];

export interface LoadOptions {
  clients: number;
  durationMs: number;
  /** Relative weights of the three kinds of request; default grade saves 4, development 3, clips 3. */
  mix?: Record<LoadKind, number>;
  seed?: number;
  /** Called every 100 ms while the load runs (memory sampling). */
  onTick?: () => void;
}

/** Signs every client in, runs the mixed load for the duration, then checks the stored grades. */
export async function runLoadMix(baseUrl: string, db: Database, target: LoadTarget, options: LoadOptions): Promise<LoadReport> {
  if (options.clients > target.coaches.length) throw new Error(`${options.clients} clients but only ${target.coaches.length} coach accounts`);
  const mix = options.mix ?? { gradeSave: 4, development: 3, clipList: 3 };
  const totalWeight = LOAD_KINDS.reduce((sum, k) => sum + mix[k], 0);
  const browsers = await Promise.all(
    target.coaches.slice(0, options.clients).map(async (coach) => {
      const browser = new Browser(baseUrl);
      await browser.signIn(coach.email);
      return browser;
    }),
  );
  const cells = target.snapIds.flatMap((snapId) => target.team.playerIds.map((playerId) => ({ snapId, playerId })));
  if (cells.length < options.clients) throw new Error(`${cells.length} grade cells cannot give each of ${options.clients} clients its own`);
  const latencies: Record<LoadKind, number[]> = { gradeSave: [], development: [], clipList: [] };
  const failuresByKind: Record<LoadKind, number> = { gradeSave: 0, development: 0, clipList: 0 };
  const attempts: Record<LoadKind, number> = { gradeSave: 0, development: 0, clipList: 0 };
  const statuses: Record<string, number> = {};
  const failureSamples: string[] = [];
  let failures = 0;
  let connectionErrors = 0;
  let gradesSaved = 0;
  const told = target.versions;

  const fail = (kind: LoadKind, what: string) => {
    failures += 1;
    failuresByKind[kind] += 1;
    if (failureSamples.length < 20) failureSamples.push(`${kind}: ${what}`);
  };

  const started = Date.now();
  const endAt = started + options.durationMs;
  const ticker = options.onTick ? setInterval(options.onTick, 100) : undefined;

  await Promise.all(
    browsers.map(async (browser, client) => {
      const random = prng((options.seed ?? 0x5eed) + client * 7919);
      const graderId = target.coaches[client]!.userId;
      const mine = cells.filter((_, i) => i % options.clients === client);
      let nextCell = 0;
      while (Date.now() < endAt) {
        let pick = random() * totalWeight;
        const kind = LOAD_KINDS.find((k) => (pick -= mix[k]) < 0) ?? 'clipList';
        let method = 'GET';
        let path: string;
        let body: unknown;
        let key = '';
        if (kind === 'gradeSave' && mine.length > 0) {
          const cell = mine[nextCell++ % mine.length]!;
          key = `${cell.snapId}:${cell.playerId}:${graderId}`;
          method = 'PUT';
          path = `/api/snaps/${cell.snapId}/grades/${cell.playerId}`;
          body = { ...GRADE_BODIES[Math.floor(random() * GRADE_BODIES.length)]!, version: told.get(key) ?? 0 };
        } else if (kind === 'development') {
          path = `/api/players/${target.team.playerIds[Math.floor(random() * target.team.playerIds.length)]}/development`;
        } else {
          path = `/api/film-sessions/${target.sessionId}/clips`;
        }
        attempts[kind] += 1;
        const t0 = performance.now();
        let res: Response;
        try {
          res = await browser.send(method, path, body);
        } catch (error) {
          connectionErrors += 1;
          fail(kind, `${method} ${path}: ${(error as Error).name}: ${(error as Error).message}`);
          continue;
        }
        const text = await res.text();
        latencies[kind].push(performance.now() - t0);
        statuses[res.status] = (statuses[res.status] ?? 0) + 1;
        if (res.status !== 200) {
          fail(kind, `${method} ${path} → ${res.status} ${text.slice(0, 200)}`);
          continue;
        }
        if (kind === 'gradeSave') {
          gradesSaved += 1;
          told.set(key, (JSON.parse(text) as { version: number }).version);
        }
      }
    }),
  );
  if (ticker) clearInterval(ticker);
  const durationMs = Date.now() - started;

  // The database must hold exactly what the clients were told.
  const graderIds = target.coaches.slice(0, options.clients).map((c) => c.userId);
  const stored = graderIds.length
    ? await db.selectFrom('grades').select(['snap_id', 'player_id', 'grader_id', 'version']).where('grader_id', 'in', graderIds).execute()
    : [];
  const storedVersions = new Map(stored.map((g) => [`${g.snap_id}:${g.player_id}:${g.grader_id}`, g.version]));
  // Only this round's graders: an earlier round (a warm-up) may have had more clients.
  const inRound = new Set(graderIds.map(String));
  let gradeMismatches = 0;
  for (const [key, version] of told) if (inRound.has(key.split(':')[2]!) && storedVersions.get(key) !== version) gradeMismatches += 1;
  for (const key of storedVersions.keys()) if (!told.has(key)) gradeMismatches += 1;

  const byKind = Object.fromEntries(
    LOAD_KINDS.map((kind) => {
      const sorted = [...latencies[kind]].sort((a, b) => a - b);
      return [kind, { count: attempts[kind], failures: failuresByKind[kind], p50Ms: percentile(sorted, 50), p99Ms: percentile(sorted, 99), maxMs: sorted.at(-1) ?? NaN }];
    }),
  ) as Record<LoadKind, KindFigures>;
  const requests = LOAD_KINDS.reduce((sum, k) => sum + attempts[k], 0);
  return {
    clients: options.clients,
    durationMs,
    requests,
    requestsPerSecond: requests / (durationMs / 1000),
    byKind,
    statuses,
    failures,
    failureSamples,
    connectionErrors,
    gradesSaved,
    gradeMismatches,
  };
}

/** The report as a few printable lines. */
export function describeLoadReport(report: LoadReport): string {
  const kinds = LOAD_KINDS.map((k) => {
    const f = report.byKind[k];
    return `  ${k.padEnd(12)} ${String(f.count).padStart(6)} requests, p50 ${f.p50Ms.toFixed(1)} ms, p99 ${f.p99Ms.toFixed(1)} ms, max ${f.maxMs.toFixed(1)} ms, failures ${f.failures}`;
  });
  return [
    `${report.clients} clients for ${(report.durationMs / 1000).toFixed(1)} s: ${report.requests} requests, ${report.requestsPerSecond.toFixed(0)} requests/s`,
    ...kinds,
    `  statuses ${Object.entries(report.statuses).map(([s, n]) => `${s}×${n}`).join(' ')}; failures ${report.failures} (connection errors ${report.connectionErrors}); grades saved ${report.gradesSaved}, stored ≠ told: ${report.gradeMismatches}`,
    ...report.failureSamples.map((s) => `  ! ${s}`),
  ].join('\n');
}
