/**
 * Load drill, the long version of test/integration/load-drill.test.ts (issue 7): grade saves,
 * development reads and clip listings (bench/drills/lib/load-mix.ts) from many clients at once,
 * each signed in as its own coach, against the real server as its own process
 * (`node --import tsx server/main.ts`, NODE_ENV=production) on a fresh PostgreSQL and the S3 fake
 * (bench/lib/bench-stack.ts), all on 127.0.0.1.
 *
 *   node --import tsx bench/drills/load.ts [--quick]
 *
 * Rounds: full 20 clients × 60 s, then 50 clients × 30 s; quick 20 clients × 8 s. A 2 s warm-up
 * first. Reported per round: requests per second, p50/p99 per kind, failures (any status but 200,
 * timeouts, connection errors: every client saves only its own cells, so even a 409 counts), grades
 * stored ≠ what the clients were told, and the server's RSS growth (VmRSS every 100 ms, peak − the
 * reading before the round). Goals: 0 failures, 0 mismatches, RSS growth < 150 MiB.
 */
import { createDatabase } from '../../db/database';
import { progress, runCli } from '../lib/bench-cli';
import type { BenchOptions, BenchResult } from '../lib/bench-result';
import { withBenchStack } from '../lib/bench-stack';
import { RssSampler } from '../lib/rss-sampler';
import { describeLoadReport, LOAD_KINDS, prepareLoadTarget, runLoadMix } from './lib/load-mix';

const MiB = 1024 * 1024;
const RSS_GOAL_MIB = 150;

export async function run(options: BenchOptions): Promise<BenchResult[]> {
  const rounds = options.quick ? [{ clients: 20, seconds: 8 }] : [{ clients: 20, seconds: 60 }, { clients: 50, seconds: 30 }];
  const maxClients = Math.max(...rounds.map((r) => r.clients));
  return withBenchStack(async (stack) => {
    const database = createDatabase(stack.databaseUrl, { max: 4 });
    try {
      progress(`preparing a team with ${maxClients} coach accounts`);
      const target = await prepareLoadTarget(database.db, { clients: maxClients, snaps: 60, clips: 40, extraPlayers: 2 });
      await runLoadMix(stack.appUrl, database.db, target, { clients: maxClients, durationMs: 2000, seed: 1 });
      const results: BenchResult[] = [];
      for (const [i, round] of rounds.entries()) {
        progress(`${round.clients} clients for ${round.seconds} s`);
        const rss = new RssSampler(stack.serverPid);
        const report = await runLoadMix(stack.appUrl, database.db, target, { clients: round.clients, durationMs: round.seconds * 1000, seed: 10 + i });
        const memory = rss.stop();
        progress(describeLoadReport(report));
        const label = `${round.clients} clients`;
        results.push({ name: `${label}: throughput`, value: report.requestsPerSecond, unit: 'req/s', note: `${report.requests} requests in ${(report.durationMs / 1000).toFixed(0)} s` });
        for (const kind of LOAD_KINDS) {
          const f = report.byKind[kind];
          results.push({ name: `${label}: ${kind} p50`, value: f.p50Ms, unit: 'ms', note: `${f.count} requests` });
          results.push({ name: `${label}: ${kind} p99`, value: f.p99Ms, unit: 'ms', note: `max ${f.maxMs.toFixed(0)} ms` });
        }
        results.push({ name: `${label}: failures`, value: report.failures, unit: '', goal: '<= 0', note: report.failureSamples[0]?.slice(0, 120) ?? `statuses ${Object.entries(report.statuses).map(([s, n]) => `${s}×${n}`).join(' ')}` });
        results.push({ name: `${label}: grades stored ≠ told`, value: report.gradeMismatches, unit: '', goal: '<= 0', note: `${report.gradesSaved} saves` });
        results.push({
          name: `${label}: server RSS growth`,
          value: (memory.max - memory.before) / MiB,
          unit: 'MiB',
          goal: `< ${RSS_GOAL_MIB}`,
          note: `${(memory.before / MiB).toFixed(0)} → peak ${(memory.max / MiB).toFixed(0)} MiB`,
        });
      }
      return results;
    } finally {
      await database.close();
    }
  });
}

if (require.main === module) runCli('drills-load', run);
