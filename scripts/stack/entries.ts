import type { ChildSpec } from './managed-child';

/**
 * The programs the stack runs, each overridable for trying the orchestration with stand-ins
 * (TW_MIGRATE_ENTRY=/tmp/x.ts …). They run as `node --import tsx FILE`: the same loader as
 * `npx tsx FILE`, without npx's extra processes and half-second start-up.
 */
export const entries = {
  migrate: () => process.env.TW_MIGRATE_ENTRY || 'db/migrate.ts',
  seed: () => process.env.TW_SEED_ENTRY || 'db/seeds/demo.ts',
  server: () => process.env.TW_SERVER_ENTRY || 'server/main.ts',
  worker: () => process.env.TW_WORKER_ENTRY || 'workers/main.ts',
  s3Fake: () => 'scripts/s3-fake.ts',
  smtpFake: () => 'scripts/smtp-fake.ts',
};

export function tsxChild(
  name: string,
  entry: string,
  root: string,
  env: NodeJS.ProcessEnv,
  output: ChildSpec['output'] = 'prefix',
): ChildSpec {
  return { name, command: process.execPath, args: ['--import', 'tsx', entry], cwd: root, env, output };
}
