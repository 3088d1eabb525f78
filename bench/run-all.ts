/**
 * Every benchmark in bench/ (and bench/drills/, when there) in sequence, one table for all:
 *
 *   npm run bench [-- --quick] [-- --only grade-saves,development-queries]
 *   node --import tsx bench/run-all.ts [--quick] [--only name,name]
 *
 * A benchmark is a module exporting `run({ quick })` (bench/README.md); files without one are
 * skipped. Each runs with its own services, one after the other, so none measures another's load.
 * Benchmarks report, they never fail: the exit code is 0 even when goals are missed, and non-zero
 * only when a benchmark crashed (its error is printed; the others still run). The table, the
 * machine line and the figures (bench/results/run-all[-quick]-<time>.json) are as runCli's.
 */
import { existsSync, mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { basename, join } from 'node:path';
import { progress, REPO_ROOT } from './lib/bench-cli';
import type { BenchResult, BenchRun } from './lib/bench-result';
import { formatTable } from './lib/bench-table';
import { describeMachine, machineInfo } from './lib/machine';

/** The issue's order; other benchmarks follow alphabetically, then the drills. */
const FIRST = ['upload-throughput', 'worker-media', 'grade-saves', 'development-queries'];
/** `--quick` must stay under two minutes for everything together. */
const QUICK_BUDGET_SECONDS = 120;

interface Benchmark {
  name: string;
  file: string;
}

export function discoverBenchmarks(benchDir = join(REPO_ROOT, 'bench')): Benchmark[] {
  const tsFiles = (dir: string) =>
    existsSync(dir)
      ? readdirSync(dir)
          .filter((f) => f.endsWith('.ts') && !f.endsWith('.d.ts') && !f.endsWith('.spec.ts') && !f.endsWith('.test.ts'))
          .sort()
      : [];
  const top = tsFiles(benchDir)
    .filter((f) => f !== basename(__filename))
    .map((f) => ({ name: f.replace(/\.ts$/, ''), file: join(benchDir, f) }))
    .sort((a, b) => rank(a.name) - rank(b.name) || a.name.localeCompare(b.name));
  const drills = tsFiles(join(benchDir, 'drills')).map((f) => ({ name: `drills/${f.replace(/\.ts$/, '')}`, file: join(benchDir, 'drills', f) }));
  return [...top, ...drills];
}

function rank(name: string): number {
  const i = FIRST.indexOf(name);
  return i === -1 ? FIRST.length : i;
}

async function main(): Promise<number> {
  const args = process.argv.slice(2);
  const quick = args.includes('--quick');
  const onlyAt = args.indexOf('--only');
  const only = onlyAt === -1 ? undefined : (args[onlyAt + 1] ?? '').split(',').filter(Boolean);
  const unknown = args.filter((a, i) => a !== '--quick' && a !== '--only' && !(onlyAt !== -1 && i === onlyAt + 1));
  if (unknown.length || (only && only.length === 0)) {
    process.stderr.write(`usage: node --import tsx bench/run-all.ts [--quick] [--only name,name]  (unknown: ${unknown.join(' ')})\n`);
    return 2;
  }
  for (const stream of [process.stdout, process.stderr]) stream.on('error', () => undefined);

  const all = discoverBenchmarks();
  const missing = (only ?? []).filter((n) => !all.some((b) => b.name === n));
  if (missing.length) {
    process.stderr.write(`no such benchmark: ${missing.join(', ')} (there are: ${all.map((b) => b.name).join(', ')})\n`);
    return 2;
  }
  const chosen = only ? all.filter((b) => only.includes(b.name)) : all;
  const started = Date.now();
  const loadAtStart = loadavg()[0]!;
  const results: BenchResult[] = [];
  const timings: { name: string; seconds: number }[] = [];
  const crashed: { name: string; error: string }[] = [];

  for (const bench of chosen) {
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    const mod = require(bench.file) as { run?: BenchRun };
    if (typeof mod.run !== 'function') {
      progress(`${bench.name}: exports no run(), skipped`);
      continue;
    }
    progress(`── ${bench.name}${quick ? ' (quick)' : ''}`);
    const t0 = Date.now();
    try {
      const figures = await mod.run({ quick });
      results.push(...figures.map((r) => ({ ...r, name: `${bench.name}: ${r.name}` })));
    } catch (error) {
      const text = error instanceof Error ? (error.stack ?? error.message) : String(error);
      crashed.push({ name: bench.name, error: text });
      process.stderr.write(`${bench.name} crashed: ${text}\n`);
    }
    timings.push({ name: bench.name, seconds: (Date.now() - t0) / 1000 });
  }

  const seconds = (Date.now() - started) / 1000;
  results.push({
    name: `run-all: total time${quick ? ' (quick)' : ''}`,
    value: seconds,
    unit: 's',
    goal: quick ? `< ${QUICK_BUDGET_SECONDS}` : undefined,
    note: timings.map((t) => `${t.name} ${t.seconds.toFixed(0)} s`).join(', '),
  });
  const machine = machineInfo();
  process.stdout.write(`\n${formatTable(results, `Trenchwork benchmarks${quick ? ' (quick)' : ''}, ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC`)}`);
  process.stdout.write(`machine: ${describeMachine(machine)} (at start ${loadAtStart.toFixed(2)}) · ${seconds.toFixed(1)} s\n`);
  for (const c of crashed) process.stdout.write(`CRASHED: ${c.name} (its error is above, on stderr)\n`);

  const dir = join(REPO_ROOT, 'bench', 'results');
  mkdirSync(dir, { recursive: true });
  const file = join(dir, `run-all${quick ? '-quick' : ''}-${new Date().toISOString().replace(/[:.]/g, '-')}.json`);
  writeFileSync(
    file,
    `${JSON.stringify({ name: 'run-all', quick, at: new Date().toISOString(), seconds, timings, crashed, machine: { ...machine, load1AtStart: loadAtStart }, results }, null, 2)}\n`,
  );
  process.stdout.write(`figures: ${file}\n`);
  return crashed.length ? 1 : 0;
}

if (require.main === module) {
  main().then(
    (code) => process.exit(code),
    (error: unknown) => {
      process.stderr.write(`run-all failed: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
      process.exit(1);
    },
  );
}
