import { mkdirSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { join, resolve } from 'node:path';
import type { BenchRun } from './bench-result';
import { formatTable } from './bench-table';
import { describeMachine, machineInfo } from './machine';

export const REPO_ROOT = resolve(__dirname, '..', '..');

/**
 * The command-line entry every benchmark shares: `node --import tsx bench/<name>.ts [--quick]`.
 * Prints the table and the machine, and keeps the figures as JSON in bench/results/ (git-ignored).
 */
export function runCli(name: string, run: BenchRun): void {
  const args = process.argv.slice(2);
  const unknown = args.filter((a) => a !== '--quick');
  if (unknown.length) {
    process.stderr.write(`usage: node --import tsx bench/${name}.ts [--quick]  (unknown: ${unknown.join(' ')})\n`);
    process.exit(2);
  }
  const quick = args.includes('--quick');
  // Output piped into `head` that has gone away must not kill the run before it stops its services.
  for (const stream of [process.stdout, process.stderr]) stream.on('error', () => undefined);
  const started = Date.now();
  const loadAtStart = loadavg()[0]!;
  run({ quick }).then(
    (results) => {
      const machine = machineInfo();
      const seconds = (Date.now() - started) / 1000;
      process.stdout.write(`\n${formatTable(results, `${name}${quick ? ' (quick)' : ''}`)}`);
      process.stdout.write(`machine: ${describeMachine(machine)} (at start ${loadAtStart.toFixed(2)}) · ${seconds.toFixed(1)} s\n`);
      const dir = join(REPO_ROOT, 'bench', 'results');
      mkdirSync(dir, { recursive: true });
      const stamp = new Date().toISOString().replace(/[:.]/g, '-');
      const file = join(dir, `${name}${quick ? '-quick' : ''}-${stamp}.json`);
      writeFileSync(file, `${JSON.stringify({ name, quick, at: new Date().toISOString(), seconds, machine: { ...machine, load1AtStart: loadAtStart }, results }, null, 2)}\n`);
      process.stdout.write(`figures: ${file}\n`);
      process.exit(0);
    },
    (error: unknown) => {
      process.stderr.write(`${name} failed: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
      process.exit(1);
    },
  );
}

/** Progress lines go to stderr, so stdout holds only the table. */
export function progress(message: string): void {
  process.stderr.write(`[bench] ${message}\n`);
}
