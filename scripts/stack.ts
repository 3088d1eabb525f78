// The orchestrator behind `npm start` and `npm test` (scripts/start.sh and scripts/test.sh run the
// setup first, then hand over here):
//   node --import tsx scripts/stack.ts dev               the development stack, until Ctrl-C
//   node --import tsx scripts/stack.ts test [jest args]  throwaway services + one jest run
import { resolve } from 'node:path';
import { runDevStack } from './stack/dev-stack';
import { fail } from './stack/log';
import { runTestStack } from './stack/test-stack';

const root = resolve(__dirname, '..');

// A stray error must never skip the teardown that stops PostgreSQL and the fakes.
process.on('unhandledRejection', (reason) => fail(`unhandled: ${reason instanceof Error ? reason.stack : String(reason)}`));
process.on('uncaughtException', (error) => fail(`uncaught: ${error.stack ?? error.message}`));

async function main(): Promise<number> {
  const [mode, ...rest] = process.argv.slice(2);
  process.chdir(root);
  if (mode === 'dev') return runDevStack(root);
  if (mode === 'test') return runTestStack(root, rest);
  fail(`usage: node --import tsx scripts/stack.ts dev | test [jest args...] (got '${mode ?? ''}')`);
  return 2;
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    fail(error instanceof Error ? (error.stack ?? error.message) : String(error));
    process.exit(1);
  },
);
