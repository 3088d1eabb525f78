/**
 * Database outage drill, the long version of test/integration/database-outage.test.ts (issue 7):
 * the real server as its own process (bench/lib/bench-stack.ts) keeps serving a few clients while
 * its PostgreSQL is stopped (`pg_ctl stop -m fast`) and started again, several times.
 *
 *   node --import tsx bench/drills/database-outage.ts [--quick]
 *
 * Four clients, each signed in as its own coach, loop over GET /api/auth/me, a player's development
 * page, the session's clip list and a grade PUT of their own cell (a new grade, then edits with the
 * version the last answer gave). Outages: full 3 × 5 s, quick 1 × 3 s. Reported: answers other than
 * 200 and 503 (goal 0; a 409 or a 500 counts), the slowest answer during an outage, how long after
 * PostgreSQL is up again the first 200 comes (the pool reconnecting by itself, no restart), whether
 * the server process is the same one afterwards, whether the clients' sessions survived, and grades
 * stored ≠ what the clients were last told.
 */
import { join } from 'node:path';
import { createDatabase } from '../../db/database';
import { PostgresCluster, socketDirFor } from '../../scripts/stack/postgres-cluster';
import { progress, runCli } from '../lib/bench-cli';
import type { BenchOptions, BenchResult } from '../lib/bench-result';
import { withBenchStack } from '../lib/bench-stack';
import { Browser, prepareLoadTarget } from './lib/load-mix';

const CLIENTS = 4;

interface Answer {
  at: number;
  status: number;
  ms: number;
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

export async function run(options: BenchOptions): Promise<BenchResult[]> {
  const outages = options.quick ? 1 : 3;
  const outageMs = options.quick ? 3000 : 5000;
  return withBenchStack(async (stack) => {
    const database = createDatabase(stack.databaseUrl, { max: 2 });
    // The stack's own cluster, addressed by its folder: stop and start it like an operator would.
    const cluster = new PostgresCluster({
      dataDir: join(stack.runDir, 'pg'),
      socketDir: socketDirFor(join(stack.runDir, 'pg-run')),
      logFile: join(stack.runDir, 'postgres.log'),
      port: Number(new URL(stack.databaseUrl).port),
      throwaway: true,
    });
    try {
      const target = await prepareLoadTarget(database.db, { clients: CLIENTS, snaps: 10, clips: 10 });
      const browsers = await Promise.all(
        target.coaches.map(async (coach) => {
          const browser = new Browser(stack.appUrl);
          await browser.signIn(coach.email);
          return browser;
        }),
      );
      const answers: Answer[] = [];
      const told = new Map<string, number>();
      const failures: string[] = [];
      const started = Date.now();
      const marks: string[] = [];
      let running = true;
      const loops = browsers.map(async (browser, i) => {
        const playerId = target.team.playerIds[i % target.team.playerIds.length]!;
        const snapId = target.snapIds[i]!;
        const key = `${snapId}:${playerId}`;
        const requests: [string, string, (() => unknown) | undefined][] = [
          ['GET', '/api/auth/me', undefined],
          ['GET', `/api/players/${playerId}/development`, undefined],
          ['GET', `/api/film-sessions/${target.sessionId}/clips`, undefined],
          ['PUT', `/api/snaps/${snapId}/grades/${playerId}`, () => ({ assignment: 'right', footwork: 'plus', version: told.get(key) ?? 0 })],
        ];
        while (running) {
          for (const [method, path, body] of requests) {
            const t0 = Date.now();
            let status = 0;
            try {
              const res = await browser.send(method, path, body?.(), 15_000);
              status = res.status;
              const text = await res.text();
              if (method === 'PUT' && status === 200) told.set(key, (JSON.parse(text) as { version: number }).version);
            } catch (error) {
              status = -1;
              const cause = (error as { cause?: { code?: string; message?: string } }).cause;
              failures.push(`${method} ${path} at ${t0 - started} ms (+${Date.now() - t0} ms): ${(error as Error).message}${cause ? ` (${cause.code ?? ''} ${cause.message ?? ''})` : ''}`);
            }
            answers.push({ at: t0, status, ms: Date.now() - t0 });
          }
        }
      });

      const outageSlowest: number[] = [];
      const recoveries: number[] = [];
      await new Promise((r) => setTimeout(r, 1000));
      for (let n = 1; n <= outages; n += 1) {
        progress(`outage ${n} of ${outages}: stopping PostgreSQL for ${outageMs / 1000} s`);
        const stopAt = Date.now();
        await cluster.stop('fast');
        marks.push(`stop ${stopAt - started}..${Date.now() - started}`);
        await new Promise((r) => setTimeout(r, outageMs));
        const startAt = Date.now();
        await cluster.start();
        const upAt = Date.now();
        marks.push(`start ${startAt - started}..${upAt - started}`);
        // Until every client has had a 200 again (or 30 s).
        while (Date.now() - upAt < 30_000) {
          const okAfter = answers.filter((a) => a.at >= upAt && a.status === 200).length;
          if (okAfter >= CLIENTS * 2) break;
          await new Promise((r) => setTimeout(r, 50));
        }
        const during = answers.filter((a) => a.at >= stopAt && a.at < upAt);
        outageSlowest.push(Math.max(0, ...during.map((a) => a.ms)));
        const firstOk = answers.filter((a) => a.at >= upAt && a.status === 200).map((a) => a.at + a.ms).sort((a, b) => a - b)[0];
        recoveries.push(firstOk === undefined ? NaN : firstOk - upAt);
        await new Promise((r) => setTimeout(r, 1000));
      }
      running = false;
      await Promise.all(loops);

      const unexpected = answers.filter((a) => a.status !== 200 && a.status !== 503);
      const me = await Promise.all(browsers.map(async (b) => (await b.send('GET', '/api/auth/me')).status));
      const stored = await database.db.selectFrom('grades').select(['snap_id', 'player_id', 'version']).where('grader_id', 'in', target.coaches.map((c) => c.userId)).execute();
      const mismatches = stored.filter((g) => told.get(`${g.snap_id}:${g.player_id}`) !== g.version).length + Math.max(0, told.size - stored.length);
      const tally = [...new Set(answers.map((a) => a.status))].sort().map((s) => `${s}×${answers.filter((a) => a.status === s).length}`).join(' ');
      progress(`answers: ${tally}`);
      progress(marks.join(', '));
      for (const f of failures.slice(0, 10)) progress(`  no answer: ${f}`);
      return [
        { name: 'answers other than 200 / 503', value: unexpected.length, unit: '', goal: '<= 0', note: `${answers.length} requests: ${tally}` },
        { name: 'slowest answer during an outage', value: Math.max(...outageSlowest), unit: 'ms', note: `${outages} outage(s) of ${outageMs / 1000} s` },
        { name: 'first 200 after PostgreSQL is up', value: Math.max(...recoveries), unit: 'ms', note: `worst of ${outages}; each: ${recoveries.map((r) => r.toFixed(0)).join(', ')} ms` },
        { name: 'server process survived', value: alive(stack.serverPid) ? 1 : 0, unit: '', goal: '>= 1', note: `pid ${stack.serverPid}, never restarted` },
        { name: 'sessions still valid afterwards', value: me.filter((s) => s === 200).length, unit: `of ${CLIENTS}`, goal: `>= ${CLIENTS}` },
        { name: 'grades stored ≠ told', value: mismatches, unit: '', goal: '<= 0', note: `${stored.length} grades` },
      ];
    } finally {
      if (!cluster.isRunning()) await cluster.start().catch(() => undefined);
      await database.close();
    }
  });
}

if (require.main === module) runCli('drills-database-outage', run);
