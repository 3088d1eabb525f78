import { progress } from './bench-cli';

/**
 * While a benchmark holds services or scratch files, Ctrl-C (or SIGTERM) runs `cleanup` and then
 * exits 130, instead of leaving them behind. Returns the function that removes the handlers again.
 */
export function cleanUpOnInterrupt(what: string, cleanup: () => Promise<void>): () => void {
  const onSignal = (signal: NodeJS.Signals) => {
    progress(`${signal}: stopping ${what}`);
    void cleanup()
      .catch((error: unknown) => progress(`clean-up failed: ${error instanceof Error ? error.message : String(error)}`))
      .finally(() => process.exit(130));
  };
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);
  return () => {
    process.removeListener('SIGINT', onSignal);
    process.removeListener('SIGTERM', onSignal);
  };
}
