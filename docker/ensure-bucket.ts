import { loadConfig } from '../server/core/config';
import { createObjectStorage } from '../server/core/storage';

/**
 * One-shot container step (compose service `storage-setup`): waits for the S3-compatible store to
 * answer and makes sure the configured bucket exists, so neither the API nor the workers start
 * against a missing bucket. Any S3 store works; against a hosted bucket that already exists this
 * only checks that the credentials can reach it.
 */
const ATTEMPTS = 30;
const DELAY_MS = 2000;

async function main(): Promise<void> {
  const config = loadConfig();
  const storage = createObjectStorage(config);
  const where = `bucket ${config.s3.bucket}${config.s3.endpoint ? ` at ${config.s3.endpoint}` : ''}`;
  try {
    for (let attempt = 1; ; attempt += 1) {
      try {
        await storage.ensureBucket();
        await storage.list('.trenchwork-readiness/');
        console.log(`${where} is ready`);
        return;
      } catch (error) {
        if (attempt >= ATTEMPTS) throw new Error(`${where} is not reachable after ${ATTEMPTS} attempts: ${(error as Error).message}`);
        console.log(`waiting for ${where} (${(error as Error).name}: ${(error as Error).message})`);
        await new Promise((resolve) => setTimeout(resolve, DELAY_MS));
      }
    }
  } finally {
    storage.destroy();
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
