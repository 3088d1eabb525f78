/**
 * Load drill (issue 7): grade saves, development reads and clip listings from 20 clients at once
 * for about 10 s against the real app listening on 127.0.0.1 (in this process), each client signed
 * in as its own coach. Asserted: no failure at all (no 5xx, no unexpected 4xx: every client saves
 * only its own cells, so a 409 would be a bug; no timeout, no connection error), every stored grade
 * is the version its client was told, and the process's memory stays bounded: the live heap after a
 * full garbage collection grows by less than 40 MB over the run (what a leak of per-request state
 * would break), and the peak RSS by less than 512 MB (a ceiling only: RSS also holds garbage the
 * collector has not yet returned, which on a busy machine reached 200 MB in a 10 s run without any
 * growth of the live heap). Throughput and p50/p99 latencies are printed, never asserted: a busy
 * machine must not fail the build. The longer version is bench/drills/load.ts.
 *
 * The clients run in the same process as the server, so the latencies include the clients' own work.
 */
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { describeLoadReport, prepareLoadTarget, runLoadMix, type LoadTarget } from '../../bench/drills/lib/load-mix';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(90_000);

const CLIENTS = 20;
const DURATION_MS = Number(process.env.TW_LOAD_DRILL_MS ?? 10_000);
const HEAP_GROWTH_BOUND_MB = 40;
const RSS_GROWTH_CEILING_MB = 512;

// A full collection on demand, so the live heap (not garbage awaiting collection) is measured.
setFlagsFromString('--expose-gc');
const collectGarbage = runInNewContext('gc') as () => void;
const liveHeapMb = (): number => {
  collectGarbage();
  return process.memoryUsage().heapUsed / 1024 ** 2;
};

let t: TestApp;
let server: Server;
let baseUrl: string;
let target: LoadTarget;

beforeAll(async () => {
  // The app's pool is the test app's (10 connections, production's default): the drill must not need more.
  t = await startTestApp();
  server = createServer(t.app);
  server.keepAliveTimeout = 65_000;
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  target = await prepareLoadTarget(t.ctx.db, { clients: CLIENTS, snaps: 40, clips: 30 });
}, 60_000);

afterAll(async () => {
  server?.closeAllConnections();
  await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
  await t?.close();
});

test(`${CLIENTS} clients for ${DURATION_MS / 1000} s: no failure, grades exactly as told, memory bounded`, async () => {
  // A short warm-up, so that lazy first-use costs (compiled queries, pools) are not counted as growth.
  await runLoadMix(baseUrl, t.ctx.db, target, { clients: CLIENTS, durationMs: 1000, seed: 1 });
  const heapBefore = liveHeapMb();
  const rssBefore = process.memoryUsage().rss;
  let rssPeak = rssBefore;
  const report = await runLoadMix(baseUrl, t.ctx.db, target, {
    clients: CLIENTS,
    durationMs: DURATION_MS,
    seed: 2,
    onTick: () => {
      rssPeak = Math.max(rssPeak, process.memoryUsage().rss);
    },
  });
  const growthMb = (rssPeak - rssBefore) / 1024 ** 2;
  const heapGrowthMb = liveHeapMb() - heapBefore;
  console.log(
    `load-drill: ${describeLoadReport(report)}\n  live heap ${heapBefore.toFixed(0)} MB before, growth ${heapGrowthMb.toFixed(1)} MB (bound ${HEAP_GROWTH_BOUND_MB} MB)` +
      `; RSS ${(rssBefore / 1024 ** 2).toFixed(0)} MB before, peak ${(rssPeak / 1024 ** 2).toFixed(0)} MB (growth ${growthMb.toFixed(1)} MB, ceiling ${RSS_GROWTH_CEILING_MB} MB)`,
  );

  expect(report.failureSamples).toEqual([]);
  expect(report.failures).toBe(0);
  expect(report.connectionErrors).toBe(0);
  expect(Object.keys(report.statuses)).toEqual(['200']);
  // Every kind of request really ran, and saves really landed.
  for (const kind of ['gradeSave', 'development', 'clipList'] as const) expect(report.byKind[kind].count).toBeGreaterThan(CLIENTS);
  expect(report.gradesSaved).toBe(report.byKind.gradeSave.count);
  expect(report.gradeMismatches).toBe(0);
  expect(heapGrowthMb).toBeLessThan(HEAP_GROWTH_BOUND_MB);
  expect(growthMb).toBeLessThan(RSS_GROWTH_CEILING_MB);
});
