import type { Database } from '../../db/database';
import { seedDemo } from '../../db/seeds/demo';

export const DEMO_PASSWORD_FOR_TESTS = 'trenchwork-demo';

/** Seeds the invented demo program into a test database (the same seed `npm start` uses). */
export async function seedDemoTeam(db: Database): Promise<number> {
  await seedDemo(db, DEMO_PASSWORD_FOR_TESTS);
  return (await db.selectFrom('teams').select('id').executeTakeFirstOrThrow()).id;
}
